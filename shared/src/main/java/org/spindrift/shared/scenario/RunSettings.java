package org.spindrift.shared.scenario;

import java.util.Objects;

/**
 * How long and how finely a run goes.
 *
 * @param duration run length in coordinate time: minutes, M, or orbits of the first source's centre
 * @param snapshotCadence interval between stored snapshots (minutes or M); null means
 *     {@link #DEFAULT_SNAPSHOTS} snapshots over the duration
 * @param seed seed of every random draw
 * @param tolerance relative local error tolerance of the integrator
 * @param archiveSubsample at most this many particles are kept in {@code snapshots.h5}
 *     (spread over the sources in proportion to their particle counts); 0 keeps all
 */
public record RunSettings(TimeSpan duration, TimeSpan snapshotCadence, long seed, double tolerance,
        int archiveSubsample) {
    /** Snapshots per run when no cadence is given. */
    public static final int DEFAULT_SNAPSHOTS = 120;
    /** Default seed. */
    public static final long DEFAULT_SEED = 1L;
    /** Default relative tolerance. */
    public static final double DEFAULT_TOLERANCE = 1.0e-9;
    /** Default number of particles kept in the archive. */
    public static final int DEFAULT_ARCHIVE_SUBSAMPLE = 2000;

    public RunSettings {
        Objects.requireNonNull(duration, "duration");
    }

    /** @return a copy with another duration */
    public RunSettings withDuration(TimeSpan d) {
        return new RunSettings(d, snapshotCadence, seed, tolerance, archiveSubsample);
    }

    /** @return a copy with another seed */
    public RunSettings withSeed(long s) {
        return new RunSettings(duration, snapshotCadence, s, tolerance, archiveSubsample);
    }
}
