package org.spindrift.shared;

/**
 * Physical constants and conversions between geometric units (G = c = 1, M = 1) and the
 * units used at the edges (solar masses, megaparsecs, minutes, micro-arcseconds).
 */
public final class Units {
    private Units() {
    }

    /** Nominal solar mass parameter GM_sun in m^3 s^-2 (IAU 2015 Resolution B3). */
    public static final double GM_SUN = 1.3271244e20;
    /** Speed of light in m/s (exact, SI definition). */
    public static final double C = 299_792_458.0;
    /** Astronomical unit in m (exact, IAU 2012 Resolution B2). */
    public static final double AU = 149_597_870_700.0;
    /** Parsec in m: 648000/pi au (IAU 2015 Resolution B2). */
    public static final double PARSEC = 648_000.0 / Math.PI * AU;
    /** Megaparsec in m. */
    public static final double MEGAPARSEC = 1.0e6 * PARSEC;
    /** Micro-arcseconds per radian. */
    public static final double UAS_PER_RAD = 180.0 / Math.PI * 3600.0 * 1.0e6;

    /** @return GM/c^3 in seconds for a mass in solar masses */
    public static double timeUnitSeconds(double massSolar) {
        return massSolar * GM_SUN / (C * C * C);
    }

    /** @return GM/c^2 in metres for a mass in solar masses */
    public static double lengthUnitMetres(double massSolar) {
        return massSolar * GM_SUN / (C * C);
    }

    /** @return the angle in micro-arcseconds subtended by 1 M = GM/c^2 at the distance (small angle) */
    public static double uasPerM(double massSolar, double distanceMpc) {
        return lengthUnitMetres(massSolar) / (distanceMpc * MEGAPARSEC) * UAS_PER_RAD;
    }
}
