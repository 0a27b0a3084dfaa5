package org.spindrift.viewer.sky;

/** Look-up in a non-decreasing array of times (binary search, no allocation). */
public final class TimeIndex {
    private TimeIndex() {
    }

    /** @return the index of the last time at or before t, or -1 (none, or an empty array) */
    public static int lastAtOrBefore(double[] times, double t) {
        int lo = 0;
        int hi = times.length - 1;
        if (hi < 0 || t < times[0]) {
            return -1;
        }
        if (t >= times[hi]) {
            return hi;
        }
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (times[mid] <= t) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
