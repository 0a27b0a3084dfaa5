/**
 * Orbit and shape analysis of the gas: periods and periastron advance per particle, shear
 * shapes, lag profiles ({@code AnalysisResult}), and the plots of the orbit and landmarks
 * commands (the run's figures are drawn in the pipeline).
 *
 * Dependencies: may import history, spacetime, motion and org.spindrift.shared; not the run
 * machinery (inputs arrive as a particle history).
 */
package org.spindrift.sim.analysis;
