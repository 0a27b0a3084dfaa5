package org.spindrift.sim.scenario;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A scenario file as a tree that remembers where each value stands (line numbers), so that
 * every checking message can name file, line and key path. Built by {@link ConfigTreeReader}.
 */
public sealed interface ConfigNode {
    /** @return the 1-based line of the value in the file */
    int line();

    /** @return a short name of the node's type for messages ("a number", "a list", ...) */
    String typeName();

    /** A mapping; keys in file order. */
    record Obj(Map<String, ConfigNode> fields, Map<String, Integer> keyLines, int line) implements ConfigNode {
        public Obj {
            fields = Collections.unmodifiableMap(new LinkedHashMap<>(fields));
            keyLines = Collections.unmodifiableMap(new LinkedHashMap<>(keyLines));
        }

        @Override public String typeName() {
            return "a mapping";
        }
    }

    /** A sequence. */
    record Arr(List<ConfigNode> items, int line) implements ConfigNode {
        public Arr {
            items = List.copyOf(items);
        }

        @Override public String typeName() {
            return "a list";
        }
    }

    /** A number (integer or floating point as written). */
    record Num(double value, boolean integral, String text, int line) implements ConfigNode {
        @Override public String typeName() {
            return "a number";
        }
    }

    /** A string. */
    record Str(String value, int line) implements ConfigNode {
        @Override public String typeName() {
            return "a string";
        }
    }

    /** true or false. */
    record Bool(boolean value, int line) implements ConfigNode {
        @Override public String typeName() {
            return "true/false";
        }
    }

    /** An explicit null (empty value). */
    record Null(int line) implements ConfigNode {
        @Override public String typeName() {
            return "empty";
        }
    }
}
