package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spindrift.shared.UserInputException;

/**
 * A scenario as the tree read from its file, before checking, so that a value can be changed at
 * any key path (for example {@code sources[0].orbit.circular.radius_M} or
 * {@code sources[0].emission.flare.peak}) and the result checked again by the same loader. A fit
 * varies its free parameters this way: key paths are resolved in the tree, so they follow the
 * scenario keys wherever these are documented. Times written with a unit keep their unit; a key
 * missing from the file is added. Immutable.
 */
public final class ScenarioTree {
    private static final Pattern SEGMENT = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*)((?:\\[\\d+\\])*)");
    private static final Pattern INDEX = Pattern.compile("\\[(\\d+)\\]");

    private final Path file;
    private final ConfigNode root;

    private ScenarioTree(Path file, ConfigNode root) {
        this.file = file;
        this.root = root;
    }

    /** Reads a scenario file into a tree (syntax only; {@link #load} checks it). */
    public static ScenarioTree read(Path file) {
        return new ScenarioTree(file, ConfigTreeReader.read(file));
    }

    static ScenarioTree of(Path file, ConfigNode root) {
        return new ScenarioTree(file, root);
    }

    /** @return the file named in messages */
    public Path file() {
        return file;
    }

    /** Checks the tree with the scenario loader (errors name the file, line and key path). */
    public LoadedScenario load() {
        return ScenarioLoader.fromTree(file, root);
    }

    /** One step of a key path: a key, then zero or more list indices. */
    private record Step(String key, List<Integer> indices) {
    }

    /** @return the steps of a key path, or null when it is not a key path */
    private static List<Step> parse(String keyPath) {
        List<Step> out = new ArrayList<>();
        for (String part : keyPath.split("\\.", -1)) {
            Matcher m = SEGMENT.matcher(part);
            if (!m.matches()) {
                return null;
            }
            List<Integer> idx = new ArrayList<>();
            Matcher im = INDEX.matcher(m.group(2));
            while (im.find()) {
                idx.add(Integer.parseInt(im.group(1)));
            }
            out.add(new Step(m.group(1), idx));
        }
        return out;
    }

    /** @return whether the text has the form of a key path ({@code a.b[0].c}) */
    public static boolean isKeyPath(String keyPath) {
        return parse(keyPath) != null;
    }

    /** @return the node at a key path, or null when absent */
    private ConfigNode node(String keyPath) {
        List<Step> steps = parse(keyPath);
        if (steps == null) {
            return null;
        }
        ConfigNode n = root;
        for (Step s : steps) {
            if (!(n instanceof ConfigNode.Obj o)) {
                return null;
            }
            n = o.fields().get(s.key());
            for (int i : s.indices()) {
                if (!(n instanceof ConfigNode.Arr a) || i >= a.items().size()) {
                    return null;
                }
                n = a.items().get(i);
            }
        }
        return n;
    }

    /**
     * @return the number at a key path (for a time such as "30 min" its number), or NaN when the
     *     key is absent (a default applies)
     * @throws UserInputException when the value there is neither a number nor a time
     */
    public double value(String keyPath) {
        ConfigNode n = node(keyPath);
        if (n == null || n instanceof ConfigNode.Null) {
            return Double.NaN;
        }
        if (n instanceof ConfigNode.Num num) {
            return num.value();
        }
        if (n instanceof ConfigNode.Str s) {
            String[] parts = s.value().strip().split("\\s+");
            try {
                return Double.parseDouble(parts[0]);
            } catch (NumberFormatException e) {
                // fall through
            }
        }
        throw new UserInputException(file + ":" + n.line() + ": " + keyPath + ": is " + n.typeName()
                + ", not a number or a time; only numbers can be fitted");
    }

    /** @return the unit of the time at a key path ("min", "M", ...), or null for a plain number or an absent key */
    public String unit(String keyPath) {
        ConfigNode n = node(keyPath);
        if (n instanceof ConfigNode.Str s) {
            String[] parts = s.value().strip().split("\\s+");
            return parts.length == 2 ? parts[1] : null;
        }
        return null;
    }

    /** @return a copy with the value at the key path replaced (added when absent), keeping a time's unit */
    public ScenarioTree with(String keyPath, double v) {
        List<Step> steps = parse(keyPath);
        if (steps == null) {
            throw new IllegalArgumentException("not a key path: " + keyPath);
        }
        String unit = unit(keyPath);
        return new ScenarioTree(file, replace(root, steps, 0, v, unit));
    }

    private static ConfigNode replace(ConfigNode n, List<Step> steps, int at, double v, String unit) {
        if (at == steps.size()) {
            int line = n == null ? 0 : n.line();
            String text = Double.toString(v);
            return unit != null ? new ConfigNode.Str(text + " " + unit, line) : new ConfigNode.Num(v, false, text, line);
        }
        Step s = steps.get(at);
        ConfigNode.Obj o = n instanceof ConfigNode.Obj ob ? ob : new ConfigNode.Obj(Map.of(), Map.of(), n == null ? 0 : n.line());
        Map<String, ConfigNode> fields = new LinkedHashMap<>(o.fields());
        Map<String, Integer> lines = new LinkedHashMap<>(o.keyLines());
        ConfigNode child = fields.get(s.key());
        lines.putIfAbsent(s.key(), o.line());
        fields.put(s.key(), replaceIndexed(child, s.indices(), 0, steps, at, v, unit));
        return new ConfigNode.Obj(fields, lines, o.line());
    }

    private static ConfigNode replaceIndexed(ConfigNode n, List<Integer> idx, int k, List<Step> steps, int at, double v,
                                             String unit) {
        if (k == idx.size()) {
            return replace(n, steps, at + 1, v, unit);
        }
        if (!(n instanceof ConfigNode.Arr a) || idx.get(k) >= a.items().size()) {
            throw new IllegalArgumentException("no list entry " + idx.get(k) + " at " + steps.get(at).key());
        }
        List<ConfigNode> items = new ArrayList<>(a.items());
        items.set(idx.get(k), replaceIndexed(items.get(idx.get(k)), idx, k + 1, steps, at, v, unit));
        return new ConfigNode.Arr(items, a.line());
    }

    /** @return whether the list entries named by the key path exist (the last key itself may be absent) */
    public boolean listsExist(String keyPath) {
        List<Step> steps = parse(keyPath);
        if (steps == null) {
            return false;
        }
        ConfigNode n = root;
        for (Step s : steps) {
            if (n == null) {
                return true;        // an absent mapping is added
            }
            if (!(n instanceof ConfigNode.Obj o)) {
                return false;
            }
            n = o.fields().get(s.key());
            for (int i : s.indices()) {
                if (!(n instanceof ConfigNode.Arr a) || i >= a.items().size()) {
                    return false;
                }
                n = a.items().get(i);
            }
        }
        return true;
    }
}
