package org.spindrift.viewer.scene;

/**
 * Where the distant observer is, in the display's Cartesian frame, and the observer time of light
 * from a point. The line of sight towards the observer is
 * n = (sin i cos phi_o, sin i sin phi_o, cos i) with inclination i from the spin axis and the observer's azimuth phi_o fixed at {@link #AZIMUTH_DEG}.
 */
public final class ObserverGeometry {
    /**
     * Azimuth of the observer about the spin axis, degrees: the light stage's camera looks from
     * n = (sin i, 0, cos i) with screen axes alpha = +y (west at PA = 0) and beta = (-cos i, 0, sin i)
     * (sim.light.Camera), which is exactly what {@link OrbitCamera} shows at polar angle i, azimuth 0.
     */
    public static final double AZIMUTH_DEG = 0.0;

    private final double nx;
    private final double ny;
    private final double nz;
    private final double inclinationDeg;
    private final double positionAngleDeg;

    public ObserverGeometry(double inclinationDeg, double positionAngleDeg) {
        this.inclinationDeg = Double.isFinite(inclinationDeg) ? inclinationDeg : 60.0;
        this.positionAngleDeg = Double.isFinite(positionAngleDeg) ? positionAngleDeg : 0.0;
        double i = Math.toRadians(this.inclinationDeg);
        double a = Math.toRadians(AZIMUTH_DEG);
        nx = Math.sin(i) * Math.cos(a);
        ny = Math.sin(i) * Math.sin(a);
        nz = Math.cos(i);
    }

    public double inclinationDeg() {
        return inclinationDeg;
    }

    public double positionAngleDeg() {
        return positionAngleDeg;
    }

    /**
     * Observer time of light leaving the point (x, y, z) at coordinate time t, with the origin
     * chosen so that light from the black hole's position at t arrives at t: t_o = t - n.x, the
     * flat-space (Roemer) light-travel difference across the system (common practice, no source;
     * the Shapiro delay and lensing are ignored: this is a label, the light stage computes the
     * real delays).
     */
    public double observerTime(double t, double x, double y, double z) {
        return t - (nx * x + ny * y + nz * z);
    }

    /** Puts the camera where the observer is: the spin axis is rolled to the position angle. */
    public void apply(OrbitCamera camera, double distance) {
        camera.set(inclinationDeg, AZIMUTH_DEG, distance, positionAngleDeg);
    }
}
