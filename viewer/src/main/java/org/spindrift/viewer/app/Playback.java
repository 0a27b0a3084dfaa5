package org.spindrift.viewer.app;

import org.spindrift.viewer.sky.TimeIndex;

/**
 * The replay clock: the current coordinate time, play/pause, speed, and the snapshot pair that
 * brackets the time. Time is the coordinate time t of the snapshots (the emitter's time, M).
 */
public final class Playback {
    private final double[] times;
    private double now;
    private boolean playing;
    private double speed; // M of coordinate time per second of wall time
    private int index;    // times[index] <= now < times[index + 1]
    private int direction = 1;

    public Playback(double[] times) {
        this.times = times;
        now = times[0];
        double span = times[times.length - 1] - times[0];
        speed = span > 0 ? niceSpeed(span / 30.0) : 1; // whole run in about half a minute
    }

    private static double niceSpeed(double x) {
        double p = Math.pow(2, Math.round(Math.log(x) / Math.log(2)));
        return p;
    }

    /** Advances the clock by dt seconds of wall time when playing; stops at the end. */
    public void tick(double dtSeconds) {
        if (!playing) {
            return;
        }
        seek(now + speed * dtSeconds);
        if (now >= end()) {
            playing = false;
        }
    }

    public void seek(double t) {
        double before = now;
        now = Math.max(start(), Math.min(end(), t));
        direction = now >= before ? 1 : -1;
        locate();
    }

    /** Jumps to snapshot s (clamped). */
    public void seekSnapshot(int s) {
        seek(times[Math.max(0, Math.min(times.length - 1, s))]);
    }

    /** Steps to the next (+1) or previous (-1) snapshot and pauses. */
    public void step(int dir) {
        playing = false;
        int s = index;
        if (dir > 0) {
            seekSnapshot(s + 1);
        } else {
            seekSnapshot(mix() > 1e-9 ? s : s - 1);
        }
        direction = dir >= 0 ? 1 : -1;
    }

    private void locate() {
        index = Math.max(0, TimeIndex.lastAtOrBefore(times, now));
    }

    public void togglePlay() {
        if (!playing && now >= end()) {
            seek(start());
        }
        playing = !playing;
    }

    public void faster() {
        speed *= 2;
    }

    public void slower() {
        speed /= 2;
    }

    public boolean playing() {
        return playing;
    }

    public double now() {
        return now;
    }

    public double speed() {
        return speed;
    }

    public double start() {
        return times[0];
    }

    public double end() {
        return times[times.length - 1];
    }

    /** @return the snapshot at or before now */
    public int index() {
        return index;
    }

    /** @return the snapshot after {@link #index()} (same at the end) */
    public int next() {
        return Math.min(index + 1, times.length - 1);
    }

    /** @return the fraction of the way from {@link #index()} to {@link #next()} */
    public double mix() {
        int b = next();
        if (b == index) {
            return 0;
        }
        return (now - times[index]) / (times[b] - times[index]);
    }

    /** @return +1 when time last moved forward, -1 when backward */
    public int direction() {
        return direction;
    }

    /** @return the fraction 0..1 of the run played */
    public double fraction() {
        double span = end() - start();
        return span > 0 ? (now - start()) / span : 0;
    }
}
