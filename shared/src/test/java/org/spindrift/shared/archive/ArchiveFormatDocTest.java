package org.spindrift.shared.archive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The format document (docs/archive-format.md) and the names the code writes agree: every file,
 * dataset, landmark key, end-state name and CSV column defined in {@link ArchiveLayout} and
 * {@link ArchiveColumns} is documented, and every CSV column list is complete and in order in the
 * document. Users read the document, not the code, so a name that drifts on one side is a defect.
 */
class ArchiveFormatDocTest {
    /** Tests run in the module folder (Maven's basedir); the document is beside the modules. */
    private static final Path DOC = Path.of("..", "docs", "archive-format.md");

    private static String doc() throws Exception {
        assertTrue(Files.isRegularFile(DOC), "format document at " + DOC.toAbsolutePath());
        return Files.readString(DOC, StandardCharsets.UTF_8);
    }

    /** @return the values of the public String constants of type whose names start with one of the prefixes */
    private static Set<String> constants(Class<?> type, String... prefixes) throws IllegalAccessException {
        Set<String> out = new LinkedHashSet<>();
        for (Field f : type.getFields()) {
            if (Modifier.isStatic(f.getModifiers()) && f.getType() == String.class) {
                for (String p : prefixes) {
                    if (f.getName().startsWith(p)) {
                        out.add((String) f.get(null));
                    }
                }
            }
        }
        return out;
    }

    @Test void everyNameTheCodeWritesIsDocumented() throws Exception {
        String doc = doc();
        List<String> missing = new ArrayList<>();
        Set<String> names = new LinkedHashSet<>();
        for (Field f : ArchiveLayout.class.getFields()) {
            String n = f.getName();
            boolean file = f.getType() == String.class && Modifier.isStatic(f.getModifiers())
                    && ((String) f.get(null)).matches("[a-z_]+\\.(json|h5|csv|fits|uvfits)");
            if (file) {
                names.add((String) f.get(null));
            }
        }
        assertTrue(names.size() >= 13, "file-name constants found: " + names);
        names.addAll(constants(ArchiveLayout.class, "D_", "LM_"));
        names.add(ArchiveLayout.END_STATES);
        names.add(ArchiveLayout.LANDMARKS);
        for (ArchiveLayout.EndStateName e : ArchiveLayout.EndStateName.values()) {
            names.add(e.key());
        }
        names.addAll(constants(ArchiveColumns.class, ""));
        for (String n : names) {
            if (!doc.contains("`" + n + "`")) {
                missing.add(n);
            }
        }
        assertEquals(List.of(), missing, "names the code writes but docs/archive-format.md does not give (in backticks)");
    }

    @Test void columnListsAreDocumentedInOrder() throws Exception {
        String doc = doc();
        check(doc, "`centroid.csv` (one row per frame):", ArchiveColumns.CENTROID);
        check(doc, "`lightcurve.csv`:", ArchiveColumns.LIGHTCURVE);
        check(doc, "`mock_astrometry.csv`:", ArchiveColumns.MOCK_ASTROMETRY);
        check(doc, "`visibilities.csv`:", ArchiveColumns.VISIBILITIES);
        check(doc, "`closure_phases.csv`:", ArchiveColumns.CLOSURE_PHASES);
        check(doc, "`periods.csv` (one row per kept particle):", ArchiveColumns.PERIODS);
        check(doc, "`shear.csv` (one row per source and snapshot):", ArchiveColumns.SHEAR);
    }

    /** The columns appear in order in the document after the marker (which must occur once). */
    private static void check(String doc, String marker, List<String> columns) {
        int at = doc.indexOf(marker);
        assertEquals(at, doc.lastIndexOf(marker), "marker " + marker + " occurs more than once");
        assertTrue(at >= 0, "document has no section " + marker);
        for (String c : columns) {
            int next = doc.indexOf("`" + c + "`", at);
            assertTrue(next >= 0, marker + ": column " + c + " missing or out of order");
            at = next;
        }
    }
}
