package org.spindrift.sim.motion;

import java.util.Locale;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Horizons;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The three ways of starting a test mass: (a) a circular equatorial orbit of
 * given radius and sense ({@link CircularOrbits}), (b) bound orbit elements
 * ({@link OrbitElements}, Schmidt 2002), (c) a position and a local velocity in the ZAMO frame
 * ({@link ZamoFrame}). Trajectories end at {@link Landmarks#captureRadius(Spacetime)}.
 */
public final class OrbitSetup {
    private OrbitSetup() {
    }

    /**
     * (a) Circular equatorial orbit at radius r, starting at azimuth phi.
     *
     * @throws UserInputException when no timelike circular orbit exists at r in that sense
     */
    public static InitialState circular(Spacetime st, double r, boolean prograde, double phi) {
        double e = CircularOrbits.energy(st, r, prograde);
        double l = CircularOrbits.angularMomentum(st, r, prograde);
        if (!Double.isFinite(e) || !Double.isFinite(l)) {
            throw new UserInputException(String.format(Locale.ROOT,
                    "no timelike %s circular orbit at r = %s M (it must lie outside the circular photon orbit)",
                    prograde ? "prograde" : "retrograde", r));
        }
        return new InitialState(r, 0.5 * FastMath.PI, phi, -e, 0.0, 0.0, l);
    }

    /** (b) Bound orbit from elements; see {@link OrbitElements#solve}. */
    public static OrbitElements.Solution elements(Spacetime st, double p, double e, double inclination) {
        return OrbitElements.solve(st, p, e, inclination);
    }

    /** (c) Position and local ZAMO-frame velocity (vr, vtheta, vphi), |v| &lt; 1. */
    public static InitialState zamo(Spacetime st, double r, double theta, double phi, double vr, double vtheta,
                                    double vphi) {
        return new ZamoFrame(st).initialState(r, theta, phi, vr, vtheta, vphi);
    }
}
