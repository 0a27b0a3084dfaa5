package org.spindrift.sim.interferometry;

/**
 * What the interferometry stage produced.
 *
 * @param setup the observing set-up
 * @param sampling (u, v) samples per frame
 * @param observation model and recorded visibilities, Jy
 * @param phases closure phases of the recorded visibilities
 * @param modelPhases closure phases of the model (no gains, no noise), same rows
 * @param steadyPhases closure phases of the steady point source alone (null when there is none), same rows
 * @param amplitudes log closure amplitudes of the recorded visibilities
 * @param modelAmplitudes log closure amplitudes of the model, same rows
 * @param steadyAmplitudes log closure amplitudes of the steady source alone (null when none), same rows
 * @param jyPerFlux Jy per image flux unit
 * @param minutesPerM minutes per M
 * @param name scenario name (UVFITS OBJECT)
 */
public record InterferometryResult(ObservingSetup setup, UvSampling sampling, Observation observation,
                                   Closures.Phases phases, Closures.Phases modelPhases, Closures.Phases steadyPhases,
                                   Closures.LogAmplitudes amplitudes, Closures.LogAmplitudes modelAmplitudes,
                                   Closures.LogAmplitudes steadyAmplitudes, double jyPerFlux, double minutesPerM,
                                   String name) {
}
