package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;
import org.spindrift.sim.scenario.ConfigNode;

/** Conversions between configuration trees (with line numbers) and JSON values. */
public final class ConfigTrees {
    private static final JsonNodeFactory F = JsonNodeFactory.instance;

    private ConfigTrees() {
    }

    /** @return the tree as JSON (numbers written as read: whole numbers as integers) */
    public static JsonNode toJson(ConfigNode n) {
        if (n instanceof ConfigNode.Obj o) {
            ObjectNode out = F.objectNode();
            for (Map.Entry<String, ConfigNode> e : o.fields().entrySet()) {
                out.set(e.getKey(), toJson(e.getValue()));
            }
            return out;
        }
        if (n instanceof ConfigNode.Arr a) {
            ArrayNode out = F.arrayNode();
            a.items().forEach(i -> out.add(toJson(i)));
            return out;
        }
        if (n instanceof ConfigNode.Num num) {
            double v = num.value();
            if (num.integral() && v == Math.rint(v) && Math.abs(v) < 9.0e15) {
                return F.numberNode((long) v);
            }
            return F.numberNode(v);
        }
        if (n instanceof ConfigNode.Str s) {
            return F.textNode(s.value());
        }
        if (n instanceof ConfigNode.Bool b) {
            return F.booleanNode(b.value());
        }
        return F.nullNode();
    }

    /** @return a number node carrying the line it came from */
    public static ConfigNode number(double v, int line) {
        return new ConfigNode.Num(v, false, Double.toString(v), line);
    }

    /** @return the same scalar carrying another line */
    public static ConfigNode atLine(ConfigNode n, int line) {
        if (n instanceof ConfigNode.Num num) {
            return new ConfigNode.Num(num.value(), num.integral(), num.text(), line);
        }
        if (n instanceof ConfigNode.Str s) {
            return new ConfigNode.Str(s.value(), line);
        }
        if (n instanceof ConfigNode.Bool b) {
            return new ConfigNode.Bool(b.value(), line);
        }
        return n;
    }

    /** @return a scalar as a short text for tables and messages */
    public static String text(ConfigNode n) {
        if (n instanceof ConfigNode.Num num) {
            double v = num.value();
            return num.integral() && v == Math.rint(v) && Math.abs(v) < 9.0e15 ? Long.toString((long) v) : Double.toString(v);
        }
        if (n instanceof ConfigNode.Str s) {
            return s.value();
        }
        if (n instanceof ConfigNode.Bool b) {
            return Boolean.toString(b.value());
        }
        return "";
    }
}
