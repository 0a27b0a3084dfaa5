package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * A distant observer's camera: N x N pixels over a square field of view (in M) on the screen
 * (alpha, beta) of Bardeen 1973 (in: Black Holes, Les Houches, eq. 4-5 ff.; Cunningham &amp;
 * Bardeen 1973, ApJ 183, 237): alpha is the apparent displacement perpendicular to the projected
 * spin axis, beta along it. For a distant observer alpha = -lambda / sin(i) with lambda = L/E,
 * so rays with positive angular momentum appear at negative alpha.
 *
 * <p>Sky orientation: x points east, y north. The projected spin axis lies at
 * position angle PA (north through east), so the unit vector of beta on the sky is
 * (east, north) = (sin PA, cos PA) and that of alpha is (-cos PA, sin PA): at PA = 0, alpha points
 * west (to the observer's right with north up and east left). With this mapping a prograde orbit
 * (angular momentum along the spin) seen at i &lt; 90 deg turns counter-clockwise on a sky drawn
 * north up and east left, i.e. its position angle increases (north through east).
 *
 * <p>Rays start on a plane at distance {@code rObs} from the hole, perpendicular to the line of
 * sight, with directions parallel to it (the construction of Johannsen &amp; Psaltis 2010, ApJ 718,
 * 446, eqs. 5-9, as recalled from memory): the pixel (alpha, beta) sits at
 * P = d n + alpha e_alpha + beta e_beta with n = (sin i, 0, cos i), e_alpha = (0, 1, 0),
 * e_beta = (-cos i, 0, sin i) in the hole's Cartesian frame. It serves non-separable metrics too;
 * the error of replacing infinity by d is of order M b / d in the impact parameter.
 */
public final class Camera {
    private final double inclination;
    private final double positionAngle;
    private final double fieldOfView;
    private final int pixels;
    private final double distance;

    /**
     * @param inclinationDeg angle between the spin axis and the line of sight, (0, 180) deg
     * @param positionAngleDeg position angle of the projected spin axis, north through east, deg
     * @param fieldOfViewM full width of the square field of view, M
     * @param pixels pixels per side
     * @param distanceM distance of the start plane, M (large, for example 1e4)
     */
    public Camera(double inclinationDeg, double positionAngleDeg, double fieldOfViewM, int pixels,
                  double distanceM) {
        if (!(fieldOfViewM > 0) || pixels < 1 || !(distanceM > 10 * fieldOfViewM)) {
            throw new IllegalArgumentException("camera: field of view > 0, pixels >= 1, distance > 10 fov");
        }
        // the exact poles are coordinate singularities of Boyer-Lindquist coordinates; nudge off them
        double inc = FastMath.min(FastMath.max(inclinationDeg, 1.0e-3), 180.0 - 1.0e-3);
        this.inclination = FastMath.toRadians(inc);
        this.positionAngle = FastMath.toRadians(positionAngleDeg);
        this.fieldOfView = fieldOfViewM;
        this.pixels = pixels;
        this.distance = distanceM;
    }

    /** @return the inclination, radians */
    public double inclination() {
        return inclination;
    }

    /** @return the position angle of the projected spin axis, radians */
    public double positionAngle() {
        return positionAngle;
    }

    /** @return the field of view, M */
    public double fieldOfView() {
        return fieldOfView;
    }

    /** @return pixels per side */
    public int pixels() {
        return pixels;
    }

    /** @return the pixel size, M */
    public double pixelSize() {
        return fieldOfView / pixels;
    }

    /** @return the start-plane distance, M */
    public double distance() {
        return distance;
    }

    /**
     * Images are stored row-major, index row * N + col, as in a FITS image with CDELT1 &lt; 0:
     * column 0 is the easternmost, row 0 the southernmost, the hole at the centre.
     *
     * @return the sky east offset (M) of the centre of column col
     */
    public double skyX(int col) {
        // FITS convention with CDELT1 < 0: column 0 is the easternmost
        return (0.5 * pixels - col - 0.5) * pixelSize();
    }

    /** @return the sky north offset (M) of row row (row 0 the southernmost) */
    public double skyY(int row) {
        return (row + 0.5 - 0.5 * pixels) * pixelSize();
    }

    /** @return Bardeen's alpha (M) of the sky point (east, north), both in M */
    public double alpha(double east, double north) {
        return -FastMath.cos(positionAngle) * east + FastMath.sin(positionAngle) * north;
    }

    /** @return Bardeen's beta (M) of the sky point (east, north), both in M */
    public double beta(double east, double north) {
        return FastMath.sin(positionAngle) * east + FastMath.cos(positionAngle) * north;
    }

    /** @return sky east offset (M) of screen point (alpha, beta) */
    public double east(double alpha, double beta) {
        return -FastMath.cos(positionAngle) * alpha + FastMath.sin(positionAngle) * beta;
    }

    /** @return sky north offset (M) of screen point (alpha, beta) */
    public double north(double alpha, double beta) {
        return FastMath.sin(positionAngle) * alpha + FastMath.cos(positionAngle) * beta;
    }

    /**
     * Cartesian start point and unit direction towards the observer (the line of sight n) of
     * the ray through screen point (alpha, beta), in the hole's frame.
     *
     * @param out length 6: x, y, z, then n
     */
    public void startPoint(double alpha, double beta, double[] out) {
        double si = FastMath.sin(inclination);
        double ci = FastMath.cos(inclination);
        out[0] = distance * si - beta * ci;
        out[1] = alpha;
        out[2] = distance * ci + beta * si;
        out[3] = si;
        out[4] = 0.0;
        out[5] = ci;
    }

    /**
     * Initial state of the backward ray through screen point (alpha, beta) for
     * {@link org.spindrift.sim.motion.GeodesicEquations#affine}: the physical photon momentum
     * points along n (towards the observer) in the local flat-space directions, its time
     * component follows from g^{mu nu} p_mu p_nu = 0 with the full metric, and it is scaled to
     * p_t = -1 (energy 1 at infinity). The backward ray integrates the reversed momentum
     * q = -p, so q_t = +1 and q_phi = -L.
     *
     * @param y state out, length 6: t = 0, r, theta, phi, q_r, q_theta
     * @param scratch metric buffer of length {@link Spacetime#SIZE}
     * @return the physical p_phi = L of the photon
     */
    public double initialState(Spacetime spacetime, double alpha, double beta, double[] y, double[] scratch) {
        double[] p = new double[6];
        startPoint(alpha, beta, p);
        return initialState(spacetime, p[0], p[1], p[2], p[3], p[4], p[5], y, scratch);
    }

    /**
     * As {@link #initialState(Spacetime, double, double, double[], double[])} for any flat-space
     * start point (x, y, z) and photon direction (nx, ny, nz) (unit vector, physical sense).
     */
    public static double initialState(Spacetime spacetime, double x, double yy, double z,
                                      double nx, double ny, double nz, double[] y, double[] g) {
        double rho = FastMath.sqrt(x * x + yy * yy);
        double r = FastMath.sqrt(rho * rho + z * z);
        double th = FastMath.atan2(rho, z);
        double ph = FastMath.atan2(yy, x);
        double st = FastMath.sin(th);
        double ct = FastMath.cos(th);
        double sp = FastMath.sin(ph);
        double cp = FastMath.cos(ph);
        // flat spherical components of the direction (contravariant)
        double kr = st * cp * nx + st * sp * ny + ct * nz;
        double kth = (ct * cp * nx + ct * sp * ny - st * nz) / r;
        double kph = (-sp * nx + cp * ny) / (r * st);
        spacetime.covariant(r, th, g);
        double a = g[Spacetime.TT];
        double b = 2.0 * g[Spacetime.TP] * kph;
        double c = g[Spacetime.PP] * kph * kph + g[Spacetime.RR] * kr * kr + g[Spacetime.HH] * kth * kth;
        // null condition a kt^2 + b kt + c = 0, future-directed root (a < 0 outside ergoregion)
        double kt = (-b - FastMath.sqrt(b * b - 4.0 * a * c)) / (2.0 * a);
        double pt = g[Spacetime.TT] * kt + g[Spacetime.TP] * kph;
        double scale = -1.0 / pt;
        double pr = g[Spacetime.RR] * kr * scale;
        double pth = g[Spacetime.HH] * kth * scale;
        double pph = (g[Spacetime.TP] * kt + g[Spacetime.PP] * kph) * scale;
        y[0] = 0.0;
        y[1] = r;
        y[2] = th;
        y[3] = ph;
        y[4] = -pr;
        y[5] = -pth;
        return pph;
    }
}
