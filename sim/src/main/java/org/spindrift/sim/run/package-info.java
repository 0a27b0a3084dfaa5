/**
 * A scenario run put together from parts with one job each: the snapshot grid, the limits checked
 * before any work (memory, disk, image budget), the evolution (integrator, history recorder,
 * motion diagnostics, turning points), checkpoints and the shutdown hook, the manifest, and
 * {@code ScenarioRun}, which runs them and the pipeline's stages in order. Progress goes to a
 * {@code ProgressListener} that the command line provides. Sits above the pipeline; fit, sweeps,
 * studies and the command line use it.
 */
package org.spindrift.sim.run;
