package org.spindrift.sim.scenario;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLParser;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.spindrift.shared.UserInputException;

/**
 * Reads a YAML or JSON scenario file into a {@link ConfigNode} tree with line numbers
 * (Jackson streaming parser; {@code .json} files with the JSON parser, everything else with the
 * YAML one). Rejects empty files, binary content and duplicate keys.
 */
public final class ConfigTreeReader {
    /** Largest scenario file, bytes (1 MiB; real scenarios are a few kB). */
    static final long MAX_BYTES = 1L << 20;

    private ConfigTreeReader() {
    }

    public static ConfigNode read(Path file) {
        byte[] bytes;
        try {
            long size = Files.size(file);
            if (size > MAX_BYTES) {
                throw new UserInputException(file + ": " + size + " bytes is more than a scenario file may have ("
                        + MAX_BYTES + " bytes = 1 MiB; scenarios are a few kB)");
            }
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new UserInputException(file + ": no such file");
        } catch (IOException e) {
            throw new UserInputException(file + ": cannot be read (" + e.getMessage() + ")");
        }
        String text = decode(file, bytes);
        if (text.isBlank()) {
            throw new UserInputException(file + ": the file is empty; a scenario needs at least black_hole, observer, sources and run");
        }
        boolean json = file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".json");
        // non-numeric numbers are read so that they can be refused with a clear message
        JsonFactory f = json ? JsonFactory.builder().enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS).build()
                : new YAMLFactory();
        f.enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION);
        try (JsonParser p = f.createParser(text)) {
            JsonToken t = p.nextToken();
            if (t == null) {
                throw new UserInputException(file + ": the file holds no values (only comments?); a scenario needs at least"
                        + " black_hole, observer, sources and run");
            }
            ConfigNode root = value(file, p, t, "");
            JsonToken extra = p.nextToken();
            if (extra != null) {
                throw new UserInputException(file + ":" + line(p.currentTokenLocation()) + ": more than one document in the file");
            }
            return root;
        } catch (JsonParseException e) {
            String msg = e.getOriginalMessage().lines().findFirst().orElse("syntax error");
            int ln = e.getLocation() == null ? -1 : line(e.getLocation());
            String where = ln > 0 ? file + ":" + ln : file.toString();
            if (msg.startsWith("Duplicate field")) {
                throw new UserInputException(where + ": " + msg.replace("Duplicate field", "duplicate key"));
            }
            throw new UserInputException(where + ": not valid " + (json ? "JSON" : "YAML") + ": " + msg);
        } catch (IOException e) {
            throw new UserInputException(file + ": not valid " + (json ? "JSON" : "YAML") + ": "
                    + e.getMessage().lines().findFirst().orElse("unreadable"));
        }
    }

    private static String decode(Path file, byte[] bytes) {
        for (byte b : bytes) {
            if (b == 0) {
                throw new UserInputException(file + ": binary content (NUL bytes), not a YAML or JSON text file");
            }
        }
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new UserInputException(file + ": not UTF-8 text (binary content?), not a YAML or JSON file");
        }
    }

    private static int line(JsonLocation loc) {
        return loc == null ? -1 : loc.getLineNr();
    }

    private static ConfigNode value(Path file, JsonParser p, JsonToken t, String path) throws IOException {
        int ln = line(p.currentTokenLocation());
        if (p instanceof YAMLParser y && (y.isCurrentAlias() || y.getObjectId() != null)) {
            throw ConfigSection.error(file, ln, path, "YAML anchors and aliases (&name, *name) are not supported;"
                    + " write each value out");
        }
        switch (t) {
            case START_OBJECT: {
                Map<String, ConfigNode> fields = new LinkedHashMap<>();
                Map<String, Integer> lines = new LinkedHashMap<>();
                JsonToken k;
                while ((k = p.nextToken()) == JsonToken.FIELD_NAME) {
                    String name = p.currentName();
                    int kl = line(p.currentTokenLocation());
                    ConfigNode v = value(file, p, p.nextToken(), path.isEmpty() ? name : path + "." + name);
                    fields.put(name, v);
                    lines.put(name, kl);
                }
                if (k != JsonToken.END_OBJECT) {
                    throw new JsonParseException(p, "unexpected " + k);
                }
                return new ConfigNode.Obj(fields, lines, ln);
            }
            case START_ARRAY: {
                List<ConfigNode> items = new ArrayList<>();
                JsonToken k;
                while ((k = p.nextToken()) != JsonToken.END_ARRAY) {
                    if (k == null) {
                        throw new JsonParseException(p, "unterminated list");
                    }
                    items.add(value(file, p, k, path + "[" + items.size() + "]"));
                }
                return new ConfigNode.Arr(items, ln);
            }
            case VALUE_NUMBER_INT:
                return new ConfigNode.Num(p.getValueAsDouble(), true, p.getText(), ln);
            case VALUE_NUMBER_FLOAT: {
                // YAML's .nan / .inf (any case, signed), JSON's NaN / Infinity
                double v = p.getText().strip().matches("(?i)[-+]?\\.(nan|inf)") ? Double.NaN : p.getDoubleValue();
                if (!Double.isFinite(v)) {
                    throw ConfigSection.error(file, ln, path, "numbers must be finite, got " + p.getText());
                }
                return new ConfigNode.Num(v, false, p.getText(), ln);
            }
            case VALUE_TRUE:
                return new ConfigNode.Bool(true, ln);
            case VALUE_FALSE:
                return new ConfigNode.Bool(false, ln);
            case VALUE_NULL:
                return new ConfigNode.Null(ln);
            case VALUE_STRING:
                return new ConfigNode.Str(p.getText(), ln);
            default:
                throw new JsonParseException(p, "unexpected " + t);
        }
    }
}
