package org.precedent.engine.rerank;

import java.io.IOException;
import java.util.List;
import java.util.Set;
import org.precedent.knowledge.datasets.Clinc150;

/**
 * One domain of CLINC150 (Larson et al. 2019, "An Evaluation Dataset for Intent Classification and
 * Out-of-Scope Prediction", EMNLP-IJCNLP), read in place by {@link Clinc150}. Each query becomes a
 * question and its intent, in words ({@code pin_change} -> "pin change"), the answer.
 */
public record ClincDomain(List<String> answers, List<TrainingPair> train, List<TrainingPair> validation,
    List<TrainingPair> test) {

  public static ClincDomain load(String domain) throws IOException {
    Clinc150 clinc = Clinc150.load();
    Set<String> intents = clinc.intents(domain);
    List<String> answers = intents.stream().map(Clinc150::inWords).toList();
    return new ClincDomain(answers, pairs(clinc.split("train", intents)),
        pairs(clinc.split("val", intents)), pairs(clinc.split("test", intents)));
  }

  /** The out-of-scope queries of a split ("oos_val", "oos_test"), which no intent answers. */
  public static List<String> outOfScope(String split) throws IOException {
    return Clinc150.load().split(split, null).stream().map(Clinc150.Example::query).toList();
  }

  public static String words(String intent) {
    return Clinc150.inWords(intent);
  }

  private static List<TrainingPair> pairs(List<Clinc150.Example> examples) {
    return examples.stream().map(e -> new TrainingPair(e.query(), words(e.intent()))).toList();
  }
}
