package org.spindrift.sim.interferometry;

import org.hipparchus.util.FastMath;

/** Thermal noise of one visibility. */
public final class Radiometer {
    private Radiometer() {
    }

    /**
     * Root-mean-square noise of the real (and of the imaginary) part of a visibility of the
     * baseline between stations with system equivalent flux densities SEFD_1 and SEFD_2, one
     * polarisation, no quantisation loss: sigma = sqrt(SEFD_1 SEFD_2 / (2 dnu tau)) (radiometer
     * equation for an interferometer pair, Thompson, Moran &amp; Swenson 2017, section 6.2, eq. 6.50
     * in the form with SEFD = 2 k T_sys / A_eff; equation number recalled from memory).
     *
     * @param sefd1 SEFD of station 1, Jy
     * @param sefd2 SEFD of station 2, Jy
     * @param bandwidthHz bandwidth, Hz
     * @param integrationS integration time, s
     * @return sigma, Jy
     */
    public static double sigma(double sefd1, double sefd2, double bandwidthHz, double integrationS) {
        return FastMath.sqrt(sefd1 * sefd2 / (2.0 * bandwidthHz * integrationS));
    }
}
