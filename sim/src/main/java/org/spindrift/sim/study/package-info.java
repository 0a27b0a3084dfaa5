/**
 * Distinguishability studies: study files, cells of mock data with reference and truth fits,
 * likelihood-ratio significance, outputs, and the study task kind for sweeps.
 *
 * Dependencies: may import fit, sweep, run, scenario and org.spindrift.shared.
 */
package org.spindrift.sim.study;
