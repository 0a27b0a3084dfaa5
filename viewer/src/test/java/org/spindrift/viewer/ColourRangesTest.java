package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.FloatBuffer;
import org.junit.jupiter.api.Test;
import org.spindrift.viewer.data.RunData;
import org.spindrift.viewer.scene.ColourRanges;
import org.spindrift.viewer.scene.Quantity;

/** The time-dilation colouring is a ratio on a diverging ramp: its range is centred on 1. */
class ColourRangesTest {
    @Test void timeDilationRangeIsCentredOnOne() {
        int n = 101;
        FloatBuffer b = FloatBuffer.allocate(n * RunData.STRIDE);
        for (int i = 0; i < n; i++) {
            int o = i * RunData.STRIDE;
            b.put(o + RunData.TIME_DILATION, 0.6f + 0.3f * i / (n - 1));  // all below 1 (redshifted clocks)
            b.put(o + RunData.WEIGHT, 1f);
            b.put(o + RunData.RADIUS, 5f + i);
            b.put(o + RunData.ALIVE, 1f);
        }
        ColourRanges r = new ColourRanges();
        r.add(b, n);
        r.finish();
        // 1st and 99th percentiles are 0.603 and 0.897 (common practice, no source): the larger distance from 1 wins
        assertEquals(1.0, 0.5 * (r.lo(Quantity.TIME_DILATION) + r.hi(Quantity.TIME_DILATION)), 1e-6);
        assertEquals(0.603f, r.lo(Quantity.TIME_DILATION), 1e-6);
        assertEquals(1.397f, r.hi(Quantity.TIME_DILATION), 1e-6);
        // other quantities keep their percentile range
        assertEquals(6f, r.lo(Quantity.RADIUS), 1e-6);
        assertEquals(Quantity.TIME_DILATION, Quantity.parse("time-dilation"));
    }
}
