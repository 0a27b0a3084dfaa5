package org.spindrift.viewer.sky;

import java.nio.file.Path;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.LightArchive;

/**
 * The flux-weighted centroid track of a run as the shared {@link LightArchive} reads it: observer
 * time (M), sky offsets (micro-arcseconds, x east, y north) and the total flux per frame, with the
 * look-ups the sky panel needs.
 */
public final class CentroidTrack {
    private final LightArchive.Track track;

    private CentroidTrack(LightArchive.Track track) {
        this.track = track;
    }

    /**
     * @param folder the run folder
     * @throws UserInputException naming the file, the line and what is wrong
     */
    public static CentroidTrack read(Path folder) {
        return new CentroidTrack(LightArchive.readTrack(folder));
    }

    public int size() {
        return track.size();
    }

    /** @return observer time of row i, M */
    public double t(int i) {
        return track.timeM()[i];
    }

    public double x(int i) {
        return track.x()[i];
    }

    public double y(int i) {
        return track.y()[i];
    }

    /** @return the total flux of row i */
    public double flux(int i) {
        return track.flux()[i];
    }

    /** @return the largest finite flux (0 if none) */
    public double maxFlux() {
        double m = 0;
        for (double f : track.flux()) {
            if (f > m && Double.isFinite(f)) {
                m = f;
            }
        }
        return m;
    }

    /** @return the index of the last point at or before time tObs (M), or -1 */
    public int indexAt(double tObs) {
        return TimeIndex.lastAtOrBefore(track.timeM(), tObs);
    }

    /** @return the largest |x| or |y| of the finite points, micro-arcseconds */
    public double maxOffset() {
        double m = 0;
        for (int i = 0; i < size(); i++) {
            if (Double.isFinite(x(i)) && Double.isFinite(y(i))) {
                m = Math.max(m, Math.max(Math.abs(x(i)), Math.abs(y(i))));
            }
        }
        return m;
    }
}
