/**
 * A scenario run put together from parts with one job each: the snapshot grid, the limits checked
 * before any work (memory, disk, image budget), the evolution (integrator, history recorder,
 * motion diagnostics, turning points), checkpoints and the shutdown hook, the manifest, and
 * {@code ScenarioRun}, which runs them and the pipeline's stages in order. Progress goes to a
 * {@code ProgressListener} that the command line provides; the progress-bar look for runs, fits,
 * sweeps and studies is {@code ProgressBars}.
 *
 * Dependencies: may import pipeline, the physics packages (spacetime, motion, history, scenario,
 * light) and org.spindrift.shared.
 */
package org.spindrift.sim.run;
