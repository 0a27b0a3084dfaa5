package org.spindrift.viewer.scene;

import java.nio.FloatBuffer;
import java.util.Arrays;
import org.spindrift.viewer.data.RunData;

/**
 * Fixed colour ranges per quantity for the whole replay (so colours do not flicker), from the 1st
 * to the 99th percentile of alive particles in a few sampled snapshots (emission from 0; the time
 * dilation symmetric about 1, the centre of its diverging ramp).
 * Computed once at load time.
 */
public final class ColourRanges {
    private static final int MAX_SAMPLES = 50_000;
    private final float[] lo = new float[3];
    private final float[] hi = new float[3];
    private final float[][] values = new float[3][];
    private final int[] counts = new int[3];

    public ColourRanges() {
        for (int q = 0; q < 3; q++) {
            values[q] = new float[MAX_SAMPLES];
        }
    }

    /** Adds the alive particles of one snapshot buffer (a subsample when large). */
    public void add(FloatBuffer snap, int particles) {
        int step = Math.max(1, particles * 3 / MAX_SAMPLES);
        for (int i = 0; i < particles; i += step) {
            int o = i * RunData.STRIDE;
            if (snap.get(o + RunData.ALIVE) < 0.5f) {
                continue;
            }
            add(0, snap.get(o + RunData.TIME_DILATION));
            add(1, snap.get(o + RunData.WEIGHT));
            add(2, snap.get(o + RunData.RADIUS));
        }
    }

    private void add(int q, float v) {
        if (counts[q] < MAX_SAMPLES && Float.isFinite(v)) {
            values[q][counts[q]++] = v;
        }
    }

    /** Fixes the ranges from what was added. */
    public void finish() {
        for (int q = 0; q < 3; q++) {
            float[] v = Arrays.copyOf(values[q], counts[q]);
            Arrays.sort(v);
            if (v.length == 0) {
                lo[q] = 0;
                hi[q] = 1;
                continue;
            }
            float a = v[(int) (0.01 * (v.length - 1))];
            float b = v[(int) Math.ceil(0.99 * (v.length - 1))];
            if (q == 1) {
                a = Math.min(0f, v[0]);
            }
            if (q == 0) {
                // time dilation 1/u^t: a ratio drawn on a diverging ramp, so the range is centred on 1
                float d = Math.max(Math.max(Math.abs(a - 1f), Math.abs(b - 1f)), 1e-3f);
                a = 1f - d;
                b = 1f + d;
            }
            if (!(b > a)) {
                float pad = Math.max(Math.abs(a) * 0.05f, 1e-3f);
                a -= pad;
                b += pad;
            }
            lo[q] = a;
            hi[q] = b;
            values[q] = null;
        }
    }

    public float lo(Quantity q) {
        return q.ordinal() < 3 ? lo[q.ordinal()] : 0;
    }

    public float hi(Quantity q) {
        return q.ordinal() < 3 ? hi[q.ordinal()] : 1;
    }
}
