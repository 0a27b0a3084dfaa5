/**
 * The particle history of a run: every particle at every snapshot ({@code ParticleHistory}), the
 * snapshot sink that records it from the motion engine ({@code HistoryRecorder}) and the subsample
 * a run keeps in its archive ({@code Subsample}). Imports the motion engine and the spacetime only
 * (and the shared scenario records); knows nothing about stages, light or analysis.
 */
package org.spindrift.sim.history;
