package org.spindrift.sim.scenario;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A key path into a configuration tree, such as {@code black_hole.spin} or
 * {@code sources[0].orbit.circular.radius_M}: mapping keys joined by dots, list entries by
 * {@code [index]}. The path is resolved through the file's own tree, so it needs no knowledge of
 * the keys a file kind allows; whether the key exists is decided by that kind's loader. Used by
 * sweeps (axis values) and fits (free parameters, through {@link ScenarioTree}).
 */
public final class KeyPath {
    private static final Pattern SEGMENT = Pattern.compile("([A-Za-z_][A-Za-z0-9_-]*)((?:\\[\\d{1,6}\\])*)");
    private static final Pattern INDEX = Pattern.compile("\\[(\\d{1,6})\\]");

    private final String text;
    private final List<Object> steps; // String = mapping key, Integer = list index

    private KeyPath(String text, List<Object> steps) {
        this.text = text;
        this.steps = List.copyOf(steps);
    }

    /**
     * @return the parsed path, or null when the text is not a key path (the caller reports it)
     */
    public static KeyPath parse(String text) {
        if (text == null || text.isEmpty() || text.startsWith(".") || text.endsWith(".") || text.contains("..")) {
            return null;
        }
        List<Object> steps = new ArrayList<>();
        for (String part : text.split("\\.")) {
            Matcher m = SEGMENT.matcher(part);
            if (!m.matches()) {
                return null;
            }
            steps.add(m.group(1));
            Matcher ix = INDEX.matcher(m.group(2));
            while (ix.find()) {
                steps.add(Integer.parseInt(ix.group(1)));
            }
        }
        return new KeyPath(text, steps);
    }

    @Override public String toString() {
        return text;
    }

    /**
     * @return whether an error reported at {@code other} concerns this path: the same path, one of
     *     its parents (an unknown or conflicting key on the way), or a key below it
     */
    public boolean relates(String other) {
        return other.equals(text) || text.startsWith(other + ".") || text.startsWith(other + "[")
                || other.startsWith(text + ".") || other.startsWith(text + "[");
    }

    /**
     * Puts a value at this path and returns the new tree (the old one is unchanged). Missing
     * mappings on the way are created; the new nodes carry {@code line}.
     *
     * @return the new tree
     * @throws IllegalArgumentException with a message naming the part of the path that does not fit
     *     the tree (a list index past the end, a key below a value that is not a mapping, ...)
     */
    public ConfigNode put(ConfigNode root, ConfigNode value, int line) {
        return put(root, 0, value, line, "");
    }

    private ConfigNode put(ConfigNode node, int at, ConfigNode value, int line, String done) {
        if (at == steps.size()) {
            return value;
        }
        Object step = steps.get(at);
        if (step instanceof String key) {
            String here = done.isEmpty() ? key : done + "." + key;
            if (node == null || node instanceof ConfigNode.Null) {
                node = new ConfigNode.Obj(Map.of(), Map.of(), line);
            }
            if (!(node instanceof ConfigNode.Obj obj)) {
                throw new IllegalArgumentException((done.isEmpty() ? "the top level" : done) + " is " + node.typeName()
                        + ", so it has no key '" + key + "'");
            }
            Map<String, ConfigNode> fields = new LinkedHashMap<>(obj.fields());
            Map<String, Integer> lines = new LinkedHashMap<>(obj.keyLines());
            fields.put(key, put(obj.fields().get(key), at + 1, value, line, here));
            if (!lines.containsKey(key) || at + 1 == steps.size()) {
                lines.put(key, line);
            }
            return new ConfigNode.Obj(fields, lines, obj.line());
        }
        int index = (Integer) step;
        String here = done + "[" + index + "]";
        if (!(node instanceof ConfigNode.Arr arr)) {
            throw new IllegalArgumentException(done + " is " + (node == null ? "absent" : node.typeName())
                    + ", so it has no entry [" + index + "]");
        }
        if (index >= arr.items().size()) {
            throw new IllegalArgumentException(done + " has " + arr.items().size() + " entr"
                    + (arr.items().size() == 1 ? "y" : "ies") + ", so there is no " + here);
        }
        List<ConfigNode> items = new ArrayList<>(arr.items());
        items.set(index, put(items.get(index), at + 1, value, line, here));
        return new ConfigNode.Arr(items, arr.line());
    }

    /** @return the line of the deepest node along this path that exists in the tree (0 when none) */
    public int nearestLine(ConfigNode root) {
        ConfigNode n = root;
        int line = root == null ? 0 : root.line();
        for (Object step : steps) {
            if (step instanceof String key) {
                if (!(n instanceof ConfigNode.Obj obj) || !obj.fields().containsKey(key)) {
                    return line;
                }
                Integer kl = obj.keyLines().get(key);
                n = obj.fields().get(key);
                line = kl != null ? kl : n.line();
            } else {
                int i = (Integer) step;
                if (!(n instanceof ConfigNode.Arr arr) || i >= arr.items().size()) {
                    return line;
                }
                n = arr.items().get(i);
                line = n.line();
            }
        }
        return line;
    }

    /** @return the node at this path, or null when absent */
    public ConfigNode get(ConfigNode root) {
        ConfigNode n = root;
        for (Object step : steps) {
            if (step instanceof String key) {
                if (!(n instanceof ConfigNode.Obj obj)) {
                    return null;
                }
                n = obj.fields().get(key);
            } else {
                int i = (Integer) step;
                if (!(n instanceof ConfigNode.Arr arr) || i >= arr.items().size()) {
                    return null;
                }
                n = arr.items().get(i);
            }
        }
        return n;
    }
}
