/**
 * Interferometric observables of the light stage's images: station geometry and (u,v) tracks,
 * direct Fourier visibilities, radiometer noise and gains, closure phases and log closure
 * amplitudes, CSV and UVFITS outputs.
 *
 * Dependencies: may import light, plot, spacetime and org.spindrift.shared.
 */
package org.spindrift.sim.interferometry;
