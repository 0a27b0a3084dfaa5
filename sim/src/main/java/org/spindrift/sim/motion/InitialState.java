package org.spindrift.sim.motion;

/**
 * Initial position and covariant 4-momentum of a test mass (p_t = -E, p_phi = L; unit rest
 * mass so g^{mu nu} p_mu p_nu = -1).
 */
public record InitialState(double r, double theta, double phi, double pT, double pR, double pTheta,
                           double pPhi) {
    /** @return the energy E = -p_t */
    public double energy() {
        return -pT;
    }

    /** @return the axial angular momentum L = p_phi */
    public double angularMomentum() {
        return pPhi;
    }

    /** @return a copy at another azimuth */
    public InitialState withPhi(double newPhi) {
        return new InitialState(r, theta, newPhi, pT, pR, pTheta, pPhi);
    }
}
