package org.spindrift.sim.scenario;

import java.nio.file.Path;
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
        return ScenarioLoader.load(file, root);
    }

    /** @return whether the text has the form of a key path ({@code a.b[0].c}) */
    public static boolean isKeyPath(String keyPath) {
        return KeyPath.parse(keyPath) != null;
    }

    /** @return the node at a key path, or null when absent */
    private ConfigNode node(String keyPath) {
        KeyPath kp = KeyPath.parse(keyPath);
        return kp == null ? null : kp.get(root);
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
        KeyPath kp = KeyPath.parse(keyPath);
        if (kp == null) {
            throw new IllegalArgumentException("not a key path: " + keyPath);
        }
        String unit = unit(keyPath);
        int line = kp.nearestLine(root);
        String text = Double.toString(v);
        ConfigNode value = unit != null ? new ConfigNode.Str(text + " " + unit, line)
                : new ConfigNode.Num(v, false, text, line);
        return new ScenarioTree(file, kp.put(root, value, line));
    }

    /** @return whether the list entries named by the key path exist (the last key itself may be absent) */
    public boolean listsExist(String keyPath) {
        KeyPath kp = KeyPath.parse(keyPath);
        if (kp == null) {
            return false;
        }
        try {
            kp.put(root, new ConfigNode.Null(0), 0);
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }
}
