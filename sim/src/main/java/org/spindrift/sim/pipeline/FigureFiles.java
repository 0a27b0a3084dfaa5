package org.spindrift.sim.pipeline;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.shared.archive.RunArchiveWriter;

/**
 * A figure's files (its PNG, maybe an SVG twin), encoded into memory in the order drawn and
 * written to the run's archive afterwards: the figures are drawn on several threads while the
 * files still reach the archive one by one in the fixed order of the plots stage.
 */
final class FigureFiles {
    private final List<String> names = new ArrayList<>();
    private final List<byte[]> contents = new ArrayList<>();

    /** Encodes one file into memory; a writer that fails leaves nothing of that file. */
    void write(String name, AtomicFiles.StreamWriter writer) throws IOException {
        ByteArrayOutputStream b = new ByteArrayOutputStream(1 << 16);
        writer.write(b);
        names.add(name);
        contents.add(b.toByteArray());
    }

    /** Writes the encoded files through the archive (temporary name, sha256, rename), in the order drawn. */
    void writeTo(RunArchiveWriter archive) throws IOException {
        for (int i = 0; i < names.size(); i++) {
            byte[] bytes = contents.get(i);
            archive.writeStream(names.get(i), out -> out.write(bytes));
        }
    }

    /** @return the names encoded so far, in order */
    List<String> names() {
        return List.copyOf(names);
    }
}
