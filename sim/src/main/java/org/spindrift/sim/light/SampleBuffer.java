package org.spindrift.sim.light;

import java.util.Arrays;

/**
 * Growable structure-of-arrays store of ray samples: Cartesian position (display x, y, z in M), observer-time delay (M), the photon's covariant p_r and p_theta (p_t = -1 at
 * infinity), p_phi = L (per sample, since sub-pixel rays of one pixel differ), and the affine weight d(lambda) of the sample in the transfer integral. Capacity
 * doubles when full, so appending is amortised allocation-free.
 */
final class SampleBuffer {
    float[] x = new float[0], y = new float[0], z = new float[0], delay = new float[0],
            pr = new float[0], pth = new float[0], pph = new float[0], dl = new float[0];
    int size;

    SampleBuffer(int capacity) {
        grow(capacity);
    }

    void add(double px, double py, double pz, double d, double p1, double p2, double p3, double w) {
        if (size == x.length) {
            grow(Math.max(64, 2 * size));
        }
        x[size] = (float) px;
        y[size] = (float) py;
        z[size] = (float) pz;
        delay[size] = (float) d;
        pr[size] = (float) p1;
        pth[size] = (float) p2;
        pph[size] = (float) p3;
        dl[size] = (float) w;
        size++;
    }

    /** Appends samples from..to-1 of another buffer. */
    void append(SampleBuffer o, int from, int to) {
        int m = to - from;
        if (size + m > x.length) {
            grow(Math.max(2 * x.length, size + m));
        }
        System.arraycopy(o.x, from, x, size, m);
        System.arraycopy(o.y, from, y, size, m);
        System.arraycopy(o.z, from, z, size, m);
        System.arraycopy(o.delay, from, delay, size, m);
        System.arraycopy(o.pr, from, pr, size, m);
        System.arraycopy(o.pth, from, pth, size, m);
        System.arraycopy(o.pph, from, pph, size, m);
        System.arraycopy(o.dl, from, dl, size, m);
        size += m;
    }

    private void grow(int capacity) {
        x = Arrays.copyOf(x, capacity);
        y = Arrays.copyOf(y, capacity);
        z = Arrays.copyOf(z, capacity);
        delay = Arrays.copyOf(delay, capacity);
        pr = Arrays.copyOf(pr, capacity);
        pth = Arrays.copyOf(pth, capacity);
        pph = Arrays.copyOf(pph, capacity);
        dl = Arrays.copyOf(dl, capacity);
    }
}
