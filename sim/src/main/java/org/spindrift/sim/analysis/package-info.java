/**
 * Orbit and shape analysis of the gas: periods and periastron advance per particle, shear
 * shapes, lag profiles, and their plots.
 *
 * Dependencies: may import spacetime, motion and org.spindrift.shared; not the run machinery
 * (inputs arrive as a particle history).
 */
package org.spindrift.sim.analysis;
