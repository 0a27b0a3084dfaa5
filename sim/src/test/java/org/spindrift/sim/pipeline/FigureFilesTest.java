package org.spindrift.sim.pipeline;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.shared.archive.RunArchiveWriter;

/**
 * Figure files encoded in memory reach the run folder in the order drawn, byte for byte, with the
 * manifest's SHA-256 of those bytes (the JDK's MessageDigest, FIPS 180-4, as the reference); a
 * file whose encoder fails leaves nothing behind.
 */
class FigureFilesTest {
    @TempDir Path tmp;

    static final byte[] FIRST = "first figure".getBytes(StandardCharsets.UTF_8);
    static final byte[] SECOND = "second figure".getBytes(StandardCharsets.UTF_8);

    @Test void filesArriveInOrderWithTheirBytesAndAFailedOneLeavesNothing() throws Exception {
        FigureFiles f = new FigureFiles();
        f.write("plots/b.png", out -> out.write(FIRST));
        f.write("plots/a.svg", out -> out.write(SECOND));
        IOException boom = assertThrows(IOException.class, () -> f.write("plots/c.png", out -> {
            out.write(FIRST);
            throw new IOException("encoder failed half-way");
        }));
        assertEquals("encoder failed half-way", boom.getMessage());
        assertEquals(List.of("plots/b.png", "plots/a.svg"), f.names());

        Path run = tmp.resolve("run");
        RunArchiveWriter w = RunArchiveWriter.create(run);
        f.writeTo(w);
        w.finish(RunArchiveWriter.json().createObjectNode());
        assertArrayEquals(FIRST, Files.readAllBytes(run.resolve("plots/b.png")));
        assertArrayEquals(SECOND, Files.readAllBytes(run.resolve("plots/a.svg")));
        try (Stream<Path> s = Files.list(run.resolve("plots"))) {
            assertEquals(List.of("a.svg", "b.png"), s.map(p -> p.getFileName().toString()).sorted().toList(),
                    "no file of the failed encoder, no temporary file");
        }
        try (RunArchive a = RunArchive.open(run)) {
            JsonNode files = a.manifest().get("files");
            List<String> order = new ArrayList<>();
            files.fieldNames().forEachRemaining(order::add);
            assertEquals(List.of("plots/b.png", "plots/a.svg"), order, "manifest lists the files in the order drawn");
            assertEquals(sha256(FIRST), files.get("plots/b.png").asText());
            assertEquals(sha256(SECOND), files.get("plots/a.svg").asText());
        }
    }

    static String sha256(byte[] b) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }
}
