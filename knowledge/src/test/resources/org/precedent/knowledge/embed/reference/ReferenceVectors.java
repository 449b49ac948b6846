import dev.langchain4j.model.embedding.onnx.bgesmallenv15q.BgeSmallEnV15QuantizedEmbeddingModel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Prints langchain4j's own embedding of each line of the input file as one line of JSON Lines:
 * {"text": ..., "vector": [...]} (floats printed with Float.toString, exact round trip).
 * Run: java -cp CLASSPATH ReferenceVectors sentences.txt > reference-vectors.jsonl
 */
public class ReferenceVectors {
  public static void main(String[] args) throws Exception {
    List<String> lines = Files.readAllLines(Path.of(args[0]));
    BgeSmallEnV15QuantizedEmbeddingModel model = new BgeSmallEnV15QuantizedEmbeddingModel();
    for (String line : lines) {
      float[] v = model.embed(line).content().vector();
      StringBuilder sb = new StringBuilder("{\"text\": \"");
      for (char c : line.toCharArray()) {
        if (c == '"' || c == '\\') sb.append('\\');
        sb.append(c);
      }
      sb.append("\", \"vector\": [");
      for (int i = 0; i < v.length; i++) sb.append(i == 0 ? "" : ", ").append(Float.toString(v[i]));
      System.out.println(sb.append("]}"));
    }
  }
}
