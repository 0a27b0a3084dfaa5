package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.spindrift.viewer.app.Playback;
import org.spindrift.viewer.ui.Text;

/** Label formatting against the JDK's formatter, and the replay clock's snapshot bracketing. */
class TextAndPlaybackTest {
    @Test void fixedDecimalsMatchTheJdkFormatter() {
        Text t = new Text();
        double[] values = {0, 1, -1, 0.5, 2.25, -0.04, 123.456, 99.995, 1e-7, -7654.321, 163.0};
        for (double v : values) {
            for (int d = 0; d <= 3; d++) {
                // String.format rounds HALF_UP on the decimal expansion (java.util.Formatter docs)
                String ref = String.format(Locale.ROOT, "%." + d + "f", v);
                if (ref.matches("-0(\\.0*)?")) {
                    ref = ref.substring(1); // we print no negative zero
                }
                assertEquals(ref, t.clear().fixed(v, d).toString(), "value " + v + ", " + d + " decimals");
            }
        }
        assertEquals("2", t.clear().num(2.0).toString());
        assertEquals("0.5", t.clear().num(0.5).toString());
        assertEquals("1.00e5", t.clear().sig3(1.0e5).toString());
        // three significant digits for small values too (String.format "%.3g" as reference)
        for (double v : new double[] {0.00123456, 0.0456789, 0.5, 7.891, 12.345, 999.4}) {
            assertEquals(Double.parseDouble(String.format(Locale.ROOT, "%.3g", v)),
                    Double.parseDouble(t.clear().sig3(v).toString()), 1e-12, "value " + v);
        }
        assertEquals("n/a", t.clear().fixed(Double.NaN, 2).toString());
    }

    @Test void playbackBracketsTheTimeBetweenSnapshots() {
        Playback p = new Playback(new double[] {0, 10, 30, 60});
        assertEquals(0, p.index());
        p.seek(20);
        assertEquals(1, p.index());
        assertEquals(2, p.next());
        assertEquals(0.5, p.mix(), 1e-12, "(20 - 10) / (30 - 10)");
        p.step(1);
        assertEquals(2, p.index());
        assertEquals(0, p.mix(), 1e-12);
        assertFalse(p.playing(), "stepping pauses");
        p.seek(45);
        p.step(-1);
        assertEquals(30, p.now(), 1e-12, "step back from between snapshots lands on the earlier one");
        p.seek(1e9);
        assertEquals(3, p.index());
        assertEquals(3, p.next());
        assertEquals(1, p.fraction(), 1e-12);
        p.togglePlay();
        assertTrue(p.playing());
        assertEquals(0, p.now(), 1e-12, "play at the end starts again");
        p.tick(1e9);
        assertFalse(p.playing(), "stops at the end");
        assertEquals(60, p.now(), 1e-12);
    }
}
