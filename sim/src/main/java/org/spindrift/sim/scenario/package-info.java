/**
 * Strict loaders of the input files (scenario, fit, study, station arrays): line-numbered
 * config trees, typed range-checked getters, key paths, and the checks that turn a parsed file
 * into sources placed on orbits.
 *
 * Dependencies: may import motion, spacetime and org.spindrift.shared.
 */
package org.spindrift.sim.scenario;
