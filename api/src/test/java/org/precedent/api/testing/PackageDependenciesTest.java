package org.precedent.api.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The package dependencies of the main code of all four modules, read from the sources' imports
 * and fully qualified names (a qualified name in a comment counts too: a Javadoc link is a use):
 * no package cycles, and every package documented. The rules are the redesign issue's ("no package
 * cycles"; "a package-info.java for every package"); the module boundaries themselves are held by
 * Maven, which compiles each module against the ones below it.
 */
class PackageDependenciesTest {
  private static final List<String> MODULES = List.of("demo-data/generator", "knowledge", "engine", "api");
  private static final Pattern PACKAGE = Pattern.compile("^package ([\\w.]+);", Pattern.MULTILINE);
  // An import of a Precedent class, or a qualified use such as org.precedent.knowledge.io.AtomicFiles:
  // the package is everything before the first capitalised segment.
  private static final Pattern REFERENCE = Pattern.compile("\\b(org\\.precedent(?:\\.[a-z]\\w*)+)\\.[A-Z]");

  @Test
  void noPackageDependsOnItselfThroughOthers() throws IOException {
    Map<String, Set<String>> deps = dependencies();
    assertTrue(deps.size() > 20, "packages read: " + deps.keySet());
    assertEquals(List.of(), cycles(deps), "package cycles");
  }

  @Test
  void theDependenciesTheRedesignTurnedRoundStayRemoved() throws IOException {
    Map<String, Set<String>> deps = dependencies();
    // The store is written around an index it is handed; retrieval reads the store.
    assertFalse(deps.get("org.precedent.knowledge.store").contains("org.precedent.knowledge.retrieve"));
    assertTrue(deps.get("org.precedent.knowledge.retrieve").contains("org.precedent.knowledge.store"));
    // The network is built from its own settings record; the reranker builds on the network.
    assertFalse(deps.get("org.precedent.engine.rerank.net").contains("org.precedent.engine.rerank"));
    assertTrue(deps.get("org.precedent.engine.rerank").contains("org.precedent.engine.rerank.net"));
  }

  @Test
  void everyPackageSaysWhatItIsForInAPackageInfo() throws IOException {
    List<String> undocumented = new ArrayList<>();
    for (Path dir : packageDirectories()) {
      Path info = dir.resolve("package-info.java");
      if (!Files.isRegularFile(info) || !Files.readString(info, StandardCharsets.UTF_8).contains("/**")) {
        undocumented.add(TrainedData.root().relativize(dir).toString());
      }
    }
    assertEquals(List.of(), undocumented, "packages without a documented package-info.java");
  }

  /** Package to the other Precedent packages its main sources refer to. */
  private static Map<String, Set<String>> dependencies() throws IOException {
    Map<String, Set<String>> deps = new TreeMap<>();
    for (Path file : mainSources()) {
      String text = Files.readString(file, StandardCharsets.UTF_8);
      Matcher p = PACKAGE.matcher(text);
      if (!p.find()) {
        throw new IllegalStateException(file + ": no package declaration");
      }
      String pkg = p.group(1);
      Set<String> used = deps.computeIfAbsent(pkg, k -> new TreeSet<>());
      Matcher r = REFERENCE.matcher(text);
      while (r.find()) {
        if (!r.group(1).equals(pkg)) {
          used.add(r.group(1));
        }
      }
    }
    return deps;
  }

  /** The strongly connected components of more than one package (Tarjan 1972), each sorted. */
  private static List<List<String>> cycles(Map<String, Set<String>> deps) {
    Map<String, Integer> index = new HashMap<>();
    Map<String, Integer> low = new HashMap<>();
    Deque<String> stack = new ArrayDeque<>();
    Set<String> onStack = new TreeSet<>();
    List<List<String>> found = new ArrayList<>();
    for (String start : deps.keySet()) {
      if (!index.containsKey(start)) {
        connect(start, deps, index, low, stack, onStack, found);
      }
    }
    return found;
  }

  private static void connect(String v, Map<String, Set<String>> deps, Map<String, Integer> index,
      Map<String, Integer> low, Deque<String> stack, Set<String> onStack, List<List<String>> found) {
    index.put(v, index.size());
    low.put(v, index.get(v));
    stack.push(v);
    onStack.add(v);
    for (String w : deps.getOrDefault(v, Set.of())) {
      if (!deps.containsKey(w)) {
        continue; // a package with no main sources (a typo would not compile)
      }
      if (!index.containsKey(w)) {
        connect(w, deps, index, low, stack, onStack, found);
        low.put(v, Math.min(low.get(v), low.get(w)));
      } else if (onStack.contains(w)) {
        low.put(v, Math.min(low.get(v), index.get(w)));
      }
    }
    if (low.get(v).equals(index.get(v))) {
      List<String> component = new ArrayList<>();
      String w;
      do {
        w = stack.pop();
        onStack.remove(w);
        component.add(w);
      } while (!w.equals(v));
      if (component.size() > 1) {
        component.sort(null);
        found.add(component);
      }
    }
  }

  private static List<Path> mainSources() throws IOException {
    List<Path> files = new ArrayList<>();
    for (String module : MODULES) {
      try (Stream<Path> walk = Files.walk(TrainedData.root().resolve(module).resolve("src/main/java"))) {
        walk.filter(f -> f.toString().endsWith(".java")).sorted().forEach(files::add);
      }
    }
    return files;
  }

  private static Set<Path> packageDirectories() throws IOException {
    Set<Path> dirs = new TreeSet<>();
    for (Path file : mainSources()) {
      if (!file.getFileName().toString().equals("package-info.java")) {
        dirs.add(file.getParent());
      }
    }
    return dirs;
  }
}
