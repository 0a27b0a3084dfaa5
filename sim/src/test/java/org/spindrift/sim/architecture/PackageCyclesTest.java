package org.spindrift.sim.architecture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
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
 * The packages of {@code org.spindrift.sim} form no cycle: every reference of a main source file to
 * another sim package (import lines and fully qualified names in code; comments and string
 * literals are ignored) is an edge, and the graph must be acyclic, so the layers can be read,
 * tested and changed from the bottom up. Cycle detection by depth-first search with three colours
 * (Cormen, Leiserson, Rivest &amp; Stein, Introduction to Algorithms, 3rd ed. 2009, sec. 22.3: a back
 * edge exists if and only if the graph has a cycle).
 */
class PackageCyclesTest {
    private static final String ROOT = "org.spindrift.sim";
    private static final Pattern REF = Pattern.compile("\\borg\\.spindrift\\.sim\\.([a-z][a-z0-9_]*)\\.[A-Z*]");
    private static final Path MAIN = Path.of("src", "main", "java", "org", "spindrift", "sim");

    @Test void simPackagesFormNoCycle() throws IOException {
        Map<String, Set<String>> graph = graph(MAIN);
        assertTrue(graph.size() >= 10, "packages found under " + MAIN.toAbsolutePath() + ": " + graph.keySet());
        assertTrue(graph.get("pipeline").contains("light") && graph.get("light").contains("motion"),
                "the parser sees imports: " + graph);
        List<String> cycle = cycle(graph);
        assertTrue(cycle.isEmpty(), "package cycle: " + String.join(" -> ", cycle));
    }

    @Test void theCheckFindsACycleAndTheParserIgnoresCommentsAndStrings() {
        Map<String, Set<String>> g = new TreeMap<>();
        g.put("a", new TreeSet<>(List.of("b")));
        g.put("b", new TreeSet<>(List.of("c")));
        g.put("c", new TreeSet<>(List.of("a")));
        g.put("d", new TreeSet<>(List.of("a")));
        assertEquals(List.of("a", "b", "c", "a"), cycle(g));
        g.get("c").clear();
        assertTrue(cycle(g).isEmpty());
        Set<String> refs = references("package org.spindrift.sim.x;\nimport org.spindrift.sim.motion.Snapshot;\n"
                + "// org.spindrift.sim.cli.Main\n/* org.spindrift.sim.fit.FitRun */\nclass Y { String s ="
                + " \"org.spindrift.sim.sweep.Main\"; Object o = new org.spindrift.sim.light.Camera(); }\n");
        assertEquals(Set.of("motion", "light"), refs);
    }

    /** @return package (below org.spindrift.sim) -> packages its main sources refer to */
    static Map<String, Set<String>> graph(Path root) throws IOException {
        Map<String, Set<String>> g = new TreeMap<>();
        List<Path> files;
        try (Stream<Path> s = Files.walk(root)) {
            files = s.filter(p -> p.toString().endsWith(".java")).toList();
        }
        for (Path f : files) {
            String pkg = root.relativize(f.getParent()).toString().replace(java.io.File.separatorChar, '.');
            if (pkg.isEmpty()) {
                continue;
            }
            String top = pkg.split("\\.")[0];
            Set<String> out = g.computeIfAbsent(top, k -> new TreeSet<>());
            for (String r : references(Files.readString(f))) {
                if (!r.equals(top)) {
                    out.add(r);
                }
            }
        }
        return g;
    }

    /** @return the sim packages a source file refers to (imports and qualified names in code) */
    static Set<String> references(String source) {
        String code = stripCommentsAndStrings(source);
        Set<String> out = new TreeSet<>();
        Matcher m = REF.matcher(code);
        while (m.find()) {
            out.add(m.group(1));
        }
        String self = selfPackage(code);
        out.remove(self);
        return out;
    }

    private static String selfPackage(String code) {
        Matcher m = Pattern.compile("\\bpackage\\s+" + Pattern.quote(ROOT) + "\\.([a-z][a-z0-9_]*)").matcher(code);
        return m.find() ? m.group(1) : "";
    }

    /** Blanks comments, string and character literals and text blocks (Java lexical rules, JLS 3.7, 3.10). */
    static String stripCommentsAndStrings(String s) {
        StringBuilder b = new StringBuilder(s.length());
        int i = 0;
        int n = s.length();
        while (i < n) {
            char c = s.charAt(i);
            if (c == '/' && i + 1 < n && s.charAt(i + 1) == '/') {
                while (i < n && s.charAt(i) != '\n') {
                    i++;
                }
            } else if (c == '/' && i + 1 < n && s.charAt(i + 1) == '*') {
                int end = s.indexOf("*/", i + 2);
                i = end < 0 ? n : end + 2;
                b.append(' ');
            } else if (s.startsWith("\"\"\"", i)) {
                int end = s.indexOf("\"\"\"", i + 3);
                i = end < 0 ? n : end + 3;
                b.append("\"\"");
            } else if (c == '"' || c == '\'') {
                i++;
                while (i < n && s.charAt(i) != c) {
                    i += s.charAt(i) == '\\' ? 2 : 1;
                }
                i++;
                b.append(c).append(c);
            } else {
                b.append(c);
                i++;
            }
        }
        return b.toString();
    }

    /** @return one cycle as a closed path (first = last), or empty when the graph is acyclic */
    static List<String> cycle(Map<String, Set<String>> g) {
        Map<String, Integer> colour = new TreeMap<>(); // absent white, 1 grey (on the path), 2 black
        for (String start : g.keySet()) {
            if (colour.containsKey(start)) {
                continue;
            }
            Deque<String> path = new ArrayDeque<>();
            List<String> c = visit(start, g, colour, path);
            if (!c.isEmpty()) {
                return c;
            }
        }
        return List.of();
    }

    private static List<String> visit(String v, Map<String, Set<String>> g, Map<String, Integer> colour,
            Deque<String> path) {
        colour.put(v, 1);
        path.addLast(v);
        for (String w : g.getOrDefault(v, Set.of())) {
            Integer cw = colour.get(w);
            if (cw == null) {
                List<String> c = visit(w, g, colour, path);
                if (!c.isEmpty()) {
                    return c;
                }
            } else if (cw == 1) {
                List<String> c = new ArrayList<>();
                boolean on = false;
                for (String p : path) {
                    on |= p.equals(w);
                    if (on) {
                        c.add(p);
                    }
                }
                c.add(w);
                return c;
            }
        }
        path.removeLast();
        colour.put(v, 2);
        return List.of();
    }
}
