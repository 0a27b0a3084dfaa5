package org.spindrift.shared.archive;

/**
 * Names and codes of the run archive, format version 1 (DEVELOPERS.md, "Run archive layout").
 * One place for every file name, dataset name and manifest key that writer and reader share.
 */
public final class ArchiveLayout {
    private ArchiveLayout() {
    }

    /** Value of the manifest's {@code format} key. */
    public static final String FORMAT = "spindrift-run";
    /** Archive format version written by this code. */
    public static final int FORMAT_VERSION = 1;

    // Manifest keys that the writer (sim) and the readers (shared, viewer) share.
    /** Manifest key: archive kind, {@link #FORMAT}. */
    public static final String K_FORMAT = "format";
    /** Manifest key: archive format version, {@link #FORMAT_VERSION}. */
    public static final String K_FORMAT_VERSION = "format_version";
    /** Manifest key: version of the code that wrote the run. */
    public static final String K_CODE_VERSION = "code_version";
    /** Manifest key: object: file name to sha256 of every file of the run. */
    public static final String K_FILES = "files";
    /** Manifest key: the run's random seed. */
    public static final String K_SEED = "seed";
    /** Manifest key: the scenario as run (echo). */
    public static final String K_SCENARIO = "scenario";
    /** Manifest key: name of the scenario (inside {@link #K_SCENARIO}) or of a source. */
    public static final String K_NAME = "name";
    /** Manifest key: object: the black hole. */
    public static final String K_BLACK_HOLE = "black_hole";
    /** Manifest key: black hole mass, solar masses. */
    public static final String K_MASS_SOLAR = "mass_solar";
    /** Manifest key: distance, Mpc. */
    public static final String K_DISTANCE_MPC = "distance_Mpc";
    /** Manifest key: spacetime family. */
    public static final String K_FAMILY = "family";
    /** Manifest key: dimensionless spin a/M. */
    public static final String K_SPIN = "spin";
    /** Manifest key: object: the family's deformation parameters. */
    public static final String K_PARAMETERS = "parameters";
    /** Manifest key: object: what one M is. */
    public static final String K_UNITS = "units";
    /** Manifest key: GM/c^3 in seconds. */
    public static final String K_M_SECONDS = "M_seconds";
    /** Manifest key: GM/c^2 in metres. */
    public static final String K_M_METRES = "M_metres";
    /** Manifest key: GM/(c^2 D) in micro-arcseconds. */
    public static final String K_M_UAS = "M_uas";
    /** Manifest key: object: the observer. */
    public static final String K_OBSERVER = "observer";
    /** Manifest key: inclination, degrees. */
    public static final String K_INCLINATION_DEG = "inclination_deg";
    /** Manifest key: position angle, degrees. */
    public static final String K_POSITION_ANGLE_DEG = "position_angle_deg";
    /** Manifest key: object: the snapshot time grid. */
    public static final String K_TIME = "time";
    /** Manifest key: number of snapshots (inside {@link #K_TIME}). */
    public static final String K_SNAPSHOTS = "snapshots";
    /** Manifest key: array: one object per source. */
    public static final String K_SOURCES = "sources";
    /** Manifest key: source kind. */
    public static final String K_KIND = "kind";
    /** Manifest key: particles of a source as generated. */
    public static final String K_PARTICLES = "particles";
    /** Manifest key: particles of a source kept in the archive. */
    public static final String K_KEPT = "kept";
    /** Manifest key: index of a source's first kept particle in the archive. */
    public static final String K_FIRST_INDEX = "first_index";
    /** Manifest key: object: integration diagnostics. */
    public static final String K_DIAGNOSTICS = "diagnostics";
    /** Manifest key: object: the light stage (absent without one). */
    public static final String K_LIGHT = "light";
    /** Manifest key: number of light frames (inside {@link #K_LIGHT}). */
    public static final String K_FRAMES = "frames";

    /** Manifest file, written last. */
    public static final String MANIFEST = "manifest.json";
    /** Particle snapshots (HDF5). */
    public static final String SNAPSHOTS = "snapshots.h5";
    /** Analysis summary (JSON). */
    public static final String SUMMARY = "summary.json";
    /** Per-particle periods (CSV). */
    public static final String PERIODS = "periods.csv";
    /** Shear shapes per source and snapshot (CSV). */
    public static final String SHEAR = "shear.csv";
    /** Sky centroid track (CSV, light stage). */
    public static final String CENTROID = "centroid.csv";
    /** Light curve (CSV, light stage). */
    public static final String LIGHTCURVE = "lightcurve.csv";
    /** Image cube (FITS, light stage). */
    public static final String IMAGES = "images.fits";
    /** Mock astrometric data (CSV, light stage). */
    public static final String MOCK_ASTROMETRY = "mock_astrometry.csv";
    /** Model visibilities with gains and noise (CSV, interferometry stage). */
    public static final String VISIBILITIES = "visibilities.csv";
    /** Closure phases (CSV, interferometry stage). */
    public static final String CLOSURE_PHASES = "closure_phases.csv";
    /** Log closure amplitudes (CSV, interferometry stage). */
    public static final String CLOSURE_AMPLITUDES = "closure_amplitudes.csv";
    /** Visibilities in the random-groups UVFITS layout (interferometry stage). */
    public static final String UVFITS = "visibilities.uvfits";
    /** CUNIT1 and CUNIT2 of the image cube: sky offsets in degrees (the FITS WCS default). */
    public static final String IMAGE_SKY_UNIT = "deg";
    /** CUNIT3 of the image cube: observer time in minutes. */
    public static final String IMAGE_TIME_UNIT = "min";
    /** Folder of plots. */
    public static final String PLOTS = "plots";

    /** Dataset: coordinate time of each snapshot [S], M. */
    public static final String D_TIME = "time";
    /** Dataset: source of each kept particle [N], int32. */
    public static final String D_SOURCE_INDEX = "source_index";
    /** Dataset: r [S,N]. */
    public static final String D_R = "r";
    /** Dataset: theta [S,N]. */
    public static final String D_THETA = "theta";
    /** Dataset: phi [S,N]. */
    public static final String D_PHI = "phi";
    /** Dataset: Cartesian x [S,N]. */
    public static final String D_X = "x";
    /** Dataset: Cartesian y [S,N]. */
    public static final String D_Y = "y";
    /** Dataset: Cartesian z [S,N]. */
    public static final String D_Z = "z";
    /** Dataset: contravariant 4-velocity [S,N,4]. */
    public static final String D_U = "u";
    /** Dataset: emission weight [S,N], float32. */
    public static final String D_WEIGHT = "weight";
    /** Dataset: end state [S,N], int8. */
    public static final String D_STATE = "state";
    /** Dataset: Cartesian centre of mass of each source's alive particles [S,K,3]. */
    public static final String D_CENTRE = "centre";

    /** Particle state code: alive. */
    public static final byte ALIVE = 0;
    /** Particle state code: captured (crossed the horizon or surface). */
    public static final byte CAPTURED = 1;
    /** Particle state code: escaped. */
    public static final byte ESCAPED = 2;
    /** Particle state code: integration failed. */
    public static final byte FAILED = 3;

    /** Manifest key of the per-state particle counts ({@link EndStateName}). */
    public static final String END_STATES = "end_states";

    /** Name of each particle state code in the manifest's {@code end_states} object. */
    public enum EndStateName {
        /** {@link #ALIVE}. */
        ALIVE(ArchiveLayout.ALIVE),
        /** {@link #CAPTURED}. */
        CAPTURED(ArchiveLayout.CAPTURED),
        /** {@link #ESCAPED}. */
        ESCAPED(ArchiveLayout.ESCAPED),
        /** {@link #FAILED}. */
        FAILED(ArchiveLayout.FAILED);

        private final byte code;

        EndStateName(byte code) {
            this.code = code;
        }

        /** @return the code stored in the {@code state} dataset */
        public byte code() {
            return code;
        }

        /** @return the key in the manifest's {@code end_states} object */
        public String key() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** Manifest key of the landmark radii object (values in M; a JSON null when absent). */
    public static final String LANDMARKS = "landmarks";
    /** Landmark: outer horizon radius. */
    public static final String LM_HORIZON_OUTER = "horizon_outer";
    /** Landmark: equatorial radius of the ergosurface. */
    public static final String LM_ERGOSURFACE_EQUATOR = "ergosurface_equator";
    /** Landmark: prograde innermost stable circular orbit. */
    public static final String LM_ISCO_PROGRADE = "isco_prograde";
    /** Landmark: retrograde innermost stable circular orbit. */
    public static final String LM_ISCO_RETROGRADE = "isco_retrograde";
    /** Landmark: prograde circular photon orbit. */
    public static final String LM_PHOTON_ORBIT_PROGRADE = "photon_orbit_prograde";
    /** Landmark: retrograde circular photon orbit. */
    public static final String LM_PHOTON_ORBIT_RETROGRADE = "photon_orbit_retrograde";
    /** Landmark: prograde marginally bound circular orbit. */
    public static final String LM_MARGINALLY_BOUND_PROGRADE = "marginally_bound_prograde";
    /** Landmark: radius of the maximum of the orbital frequency Omega(r), where one exists. */
    public static final String LM_OMEGA_MAX_RADIUS = "omega_max_radius";
    /** Landmark: the maximum of Omega(r), 1/M. */
    public static final String LM_OMEGA_MAX_VALUE = "omega_max_value";
    /** Landmark: where the run stops particles (horizon + margin, or the surface). */
    public static final String LM_CAPTURE_RADIUS = "capture_radius";

    /** Prefix of a file being written; see {@link AtomicFiles}. */
    public static final String PARTIAL_PREFIX = ".";
    /** Suffix of a file being written; see {@link AtomicFiles}. */
    public static final String PARTIAL_SUFFIX = ".partial";

    /**
     * Cartesian coordinates for display and spatial indexing:
     * x = sqrt(r^2+a^2) sin(theta) cos(phi), y = sqrt(r^2+a^2) sin(theta) sin(phi), z = r cos(theta)
     * (see {@link org.spindrift.shared.Coordinates}).
     *
     * @param out receives x, y, z at out[0..2]
     */
    public static void cartesian(double r, double theta, double phi, double spin, double[] out) {
        org.spindrift.shared.Coordinates.cartesian(r, theta, phi, spin, out);
    }
}
