/**
 * Fits of models to centroid tracks and light curves: the fit data, the fast model, Levenberg-
 * Marquardt with several starts, the affine-invariant ensemble sampler and the fit outputs.
 *
 * Dependencies: may import run, light, scenario, motion, spacetime and org.spindrift.shared.
 */
package org.spindrift.sim.fit;
