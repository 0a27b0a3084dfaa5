package org.spindrift.shared.archive;

import java.util.List;

/**
 * Column names of the run archive's CSV files, shared by the writers and the readers. Every file
 * starts with one header line of these names, comma separated; times are observer time.
 */
public final class ArchiveColumns {
    private ArchiveColumns() {
    }

    /** Observer time, minutes. */
    public static final String T_OBS_MIN = "t_obs_min";
    /** Observer time, M (GM/c^3). */
    public static final String T_OBS_M = "t_obs_M";
    /** East offset from the black hole, micro-arcseconds. */
    public static final String X_UAS = "x_uas";
    /** North offset from the black hole, micro-arcseconds. */
    public static final String Y_UAS = "y_uas";
    /** Total flux of a frame (relative units: sum of pixels times pixel area in M^2). */
    public static final String FLUX = "flux";
    /** East offset of the centroid with the steady point source added, micro-arcseconds. */
    public static final String X_WITH_STEADY_UAS = "x_with_steady_uas";
    /** North offset of the centroid with the steady point source added, micro-arcseconds. */
    public static final String Y_WITH_STEADY_UAS = "y_with_steady_uas";
    /** Second central moment of the image along x, micro-arcseconds squared. */
    public static final String SIGMA_XX_UAS2 = "sigma_xx_uas2";
    /** Second central moment of the image along y, micro-arcseconds squared. */
    public static final String SIGMA_YY_UAS2 = "sigma_yy_uas2";
    /** Mixed second central moment of the image, micro-arcseconds squared. */
    public static final String SIGMA_XY_UAS2 = "sigma_xy_uas2";
    /** Flux plus the steady source's flux. */
    public static final String FLUX_WITH_STEADY = "flux_with_steady";
    /** Flux over the mean flux of the flare. */
    public static final String FLUX_OVER_MEAN = "flux_over_mean";
    /** One-sigma position error per axis, micro-arcseconds. */
    public static final String SIGMA_UAS = "sigma_uas";

    /** Columns of {@link ArchiveLayout#CENTROID}. */
    public static final List<String> CENTROID = List.of(T_OBS_MIN, T_OBS_M, X_UAS, Y_UAS, FLUX, X_WITH_STEADY_UAS,
            Y_WITH_STEADY_UAS, SIGMA_XX_UAS2, SIGMA_YY_UAS2, SIGMA_XY_UAS2);
    /** Columns of {@link ArchiveLayout#LIGHTCURVE}. */
    public static final List<String> LIGHTCURVE = List.of(T_OBS_MIN, T_OBS_M, FLUX, FLUX_WITH_STEADY, FLUX_OVER_MEAN);
    /** Columns of {@link ArchiveLayout#MOCK_ASTROMETRY}. */
    public static final List<String> MOCK_ASTROMETRY = List.of(T_OBS_MIN, T_OBS_M, X_UAS, Y_UAS, SIGMA_UAS);

    /** Columns of {@link ArchiveLayout#PERIODS} (one row per kept particle; empty where not measurable). */
    public static final List<String> PERIODS = List.of("source", "particle", "mean_r_M", "period_phi_M", "period_r_M",
            "period_theta_M", "periastron_advance_deg", "period_phi_min", "period_r_min", "period_theta_min");
    /** Columns of {@link ArchiveLayout#SHEAR} (one row per source and snapshot). */
    public static final List<String> SHEAR = List.of("source", "snapshot", "time_M", "time_min", "alive", "centre_x_M",
            "centre_y_M", "centre_z_M", "centre_r_M", "major_M", "minor_M", "aspect_ratio", "orientation_deg",
            "azimuthal_extent_deg", "stationary_radius_M", "inner_arm_M", "outer_arm_M");
    /** Columns of {@link ArchiveLayout#VISIBILITIES} (u, v, w in wavelengths; flux densities in Jy). */
    public static final List<String> VISIBILITIES = List.of(T_OBS_MIN, T_OBS_M, "frame", "scan", "station1",
            "station2", "u_lambda", "v_lambda", "w_lambda", "baseline_lambda", "elevation1_deg", "elevation2_deg",
            "re_jy", "im_jy", "amp_jy", "phase_deg", "sigma_jy", "model_re_jy", "model_im_jy");
    /** Columns of {@link ArchiveLayout#CLOSURE_PHASES} (degrees). */
    public static final List<String> CLOSURE_PHASES = List.of(T_OBS_MIN, T_OBS_M, "frame", "station1", "station2",
            "station3", "closure_phase_deg", "sigma_deg", "model_deg", "steady_deg", "steady_sigma_deg");
    /** Columns of {@link ArchiveLayout#CLOSURE_AMPLITUDES} (natural logarithm of the closure amplitude). */
    public static final List<String> CLOSURE_AMPLITUDES = List.of(T_OBS_MIN, T_OBS_M, "frame", "station1",
            "station2", "station3", "station4", "numerator", "denominator", "log_closure_amp", "sigma", "model",
            "steady", "steady_sigma");

    /** @return the header line of a file with these columns (no line end) */
    public static String header(List<String> columns) {
        return String.join(",", columns);
    }

}
