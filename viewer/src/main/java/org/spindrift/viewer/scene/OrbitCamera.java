package org.spindrift.viewer.scene;

import org.joml.Matrix4f;
import org.joml.Vector3f;

/**
 * A perspective camera orbiting a target point. The eye sits at polar angle {@code polar} from the
 * +z (spin) axis and azimuth {@code azimuth} about it, at distance {@code distance}:
 * eye = target + d (sin p cos a, sin p sin a, cos p). Screen up is the direction of increasing
 * z along the sphere (-d eye/dp), so the spin axis points up the screen, and the image may be
 * rolled about the line of sight (used to put the spin axis at the observer's position angle).
 * Face-on from above (p = 0, a = -90 deg) shows +x to the right and +y up.
 *
 * <p>Matrices are final fields, updated in place (no allocation per frame).
 */
public final class OrbitCamera {
    /** Vertical field of view, degrees. */
    public static final float FOV_DEG = 35f;
    /** Near and far planes as fractions/multiples of the distance. */
    private static final float NEAR = 0.02f;
    private static final float FAR = 50f;
    private static final double MIN_POLAR = 1e-4;

    private final Matrix4f view = new Matrix4f();
    private final Matrix4f projection = new Matrix4f();
    private final Matrix4f viewProjection = new Matrix4f();
    private final Vector3f target = new Vector3f();
    private final Vector3f eye = new Vector3f();
    private final Vector3f up = new Vector3f();
    private final Vector3f scratch = new Vector3f();
    private double polar;
    private double azimuth;
    private double distance;
    private double roll;

    public OrbitCamera(double polarDeg, double azimuthDeg, double distance) {
        set(polarDeg, azimuthDeg, distance, 0);
    }

    /** Places the camera: angles in degrees, roll about the line of sight counter-clockwise. */
    public void set(double polarDeg, double azimuthDeg, double dist, double rollDeg) {
        polar = Math.toRadians(polarDeg);
        azimuth = Math.toRadians(azimuthDeg);
        distance = dist;
        roll = Math.toRadians(rollDeg);
        target.zero();
    }

    /** Turns the camera by screen drags (radians). */
    public void orbit(double dAzimuth, double dPolar) {
        azimuth += dAzimuth;
        polar = Math.max(MIN_POLAR, Math.min(Math.PI - MIN_POLAR, polar + dPolar));
    }

    /** Multiplies the distance by factor (zoom). */
    public void zoom(double factor) {
        distance = Math.max(0.5, Math.min(1e5, distance * factor));
    }

    /** Moves the target in the screen plane by a fraction of the view height. */
    public void pan(double dxFraction, double dyFraction) {
        double h = 2 * distance * Math.tan(Math.toRadians(FOV_DEG) / 2);
        view.positiveX(scratch); // camera right in world space
        target.fma((float) (-dxFraction * h), scratch);
        view.positiveY(scratch); // camera up in world space
        target.fma((float) (dyFraction * h), scratch);
    }

    /** Recomputes the matrices for a viewport of the given aspect ratio (width / height). */
    public void update(float aspect) {
        double sp = Math.sin(Math.max(polar, MIN_POLAR));
        double cp = Math.cos(Math.max(polar, MIN_POLAR));
        double ca = Math.cos(azimuth);
        double sa = Math.sin(azimuth);
        eye.set((float) (sp * ca), (float) (sp * sa), (float) cp).mul((float) distance).add(target);
        up.set((float) (-cp * ca), (float) (-cp * sa), (float) sp);
        view.setLookAt(eye.x, eye.y, eye.z, target.x, target.y, target.z, up.x, up.y, up.z);
        if (roll != 0) {
            view.rotateLocalZ((float) roll);
        }
        float d = (float) distance;
        projection.setPerspective((float) Math.toRadians(FOV_DEG), aspect, NEAR * d, FAR * d);
        projection.mul(view, viewProjection);
    }

    public Matrix4f view() {
        return view;
    }

    public Matrix4f projection() {
        return projection;
    }

    public Matrix4f viewProjection() {
        return viewProjection;
    }

    public Vector3f eye() {
        return eye;
    }

    public double distance() {
        return distance;
    }

    public double polarDeg() {
        return Math.toDegrees(polar);
    }

    public double azimuthDeg() {
        return Math.toDegrees(azimuth);
    }
}
