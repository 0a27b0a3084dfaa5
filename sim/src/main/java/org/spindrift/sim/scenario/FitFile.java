package org.spindrift.sim.scenario;

import java.nio.file.Path;
import java.util.List;

/**
 * A checked fit file: the model scenario (as a tree, so that free parameters can be set at their
 * key paths), the data files, the free parameters with bounds and priors, and the method.
 *
 * @param file the fit file
 * @param name name of the fit (default: the file name without extension)
 * @param scenario the model scenario
 * @param data data files and the data's own parameters
 * @param free free parameters, in file order
 * @param method fitting method and its settings
 */
public record FitFile(Path file, String name, ScenarioTree scenario, Data data, List<Free> free, Method method) {
    /** Key path of the data's time offset, minutes (added to the data's observer times). */
    public static final String TIME_OFFSET = "data.time_offset_min";
    /** Key path of the scale of the model flux to the data's flux units. */
    public static final String FLUX_SCALE = "data.flux_scale";

    /**
     * @param astrometry CSV with observer times, x/y offsets and their errors (optional flux)
     * @param photometry optional CSV with observer times and fluxes
     * @param fluxError one-sigma flux error relative to the peak flux, for files without a sigma_flux column (NaN: none)
     * @param timeOffsetMin added to the data's times, minutes
     * @param fluxScale data flux = scale x model flux
     */
    public record Data(Path astrometry, Path photometry, double fluxError, double timeOffsetMin, double fluxScale) {
    }

    /** Prior of a free parameter. */
    public enum Prior {
        /** Flat between the bounds. */
        UNIFORM,
        /** Flat in the logarithm between the bounds (both positive). */
        LOG_UNIFORM,
        /** Gaussian of the given mean and sigma, cut at the bounds. */
        NORMAL
    }

    /**
     * @param key key path in the scenario (or {@link #TIME_OFFSET}, {@link #FLUX_SCALE})
     * @param min lower bound
     * @param max upper bound
     * @param prior prior
     * @param mean normal prior's mean (NaN otherwise)
     * @param sigma normal prior's sigma (NaN otherwise)
     * @param start starting value (the scenario's value when not given)
     * @param line line of the entry in the fit file
     */
    public record Free(String key, double min, double max, Prior prior, double mean, double sigma, double start,
                       int line) {
    }

    /** Fitting methods. */
    public enum Kind {
        /** Levenberg-Marquardt from several starts. */
        LEAST_SQUARES,
        /** Affine-invariant ensemble sampler. */
        SAMPLE
    }

    /**
     * @param kind least squares or sampling
     * @param starts least squares: number of starts (the first at the start values, the others drawn in the bounds)
     * @param maxEvaluations least squares: model evaluations per start
     * @param seed random seed (starts, walkers)
     * @param walkers sampler: number of walkers (even, at least twice the free parameters)
     * @param steps sampler: steps per walker
     * @param burnIn sampler: steps dropped at the start
     */
    public record Method(Kind kind, int starts, int maxEvaluations, long seed, int walkers, int steps, int burnIn) {
    }
}
