/**
 * The particle history of a run: every particle at every snapshot ({@code ParticleHistory}), the
 * snapshot sink that records it from the motion engine ({@code HistoryRecorder}) and the subsample
 * a run keeps in its archive ({@code Subsample}).
 *
 * Dependencies: may import motion, spacetime and org.spindrift.shared; not the scenario loaders,
 * the stages or the run machinery (inputs arrive as values).
 */
package org.spindrift.sim.history;
