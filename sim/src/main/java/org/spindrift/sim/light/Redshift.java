package org.spindrift.sim.light;

/**
 * The redshift factor g = nu_obs / nu_em = 1 / (-p_mu u^mu) for a photon normalised to
 * p_t = -1 at infinity (e.g. Cunningham &amp; Bardeen 1973, ApJ 183, 237).
 */
public final class Redshift {
    private Redshift() {
    }

    /**
     * @param pr the photon's covariant p_r
     * @param pth covariant p_theta
     * @param pphi covariant p_phi = L
     * @param ut contravariant u^t of the emitter (and u^r, u^theta, u^phi)
     */
    public static double g(double pr, double pth, double pphi, double ut, double ur, double uth, double uph) {
        return 1.0 / inverse(pr, pth, pphi, ut, ur, uth, uph);
    }

    /** @return 1 / g = -p_mu u^mu = u^t - p_r u^r - p_theta u^theta - p_phi u^phi (p_t = -1) */
    public static double inverse(double pr, double pth, double pphi, double ut, double ur, double uth, double uph) {
        return ut - pr * ur - pth * uth - pphi * uph;
    }
}
