/**
 * A scenario run: preparation and resource checks, the evolution with its history, the stage
 * pipeline, checkpoints and resume, run notes, progress bars.
 *
 * Dependencies: may import the physics packages (spacetime, motion, scenario, light, analysis,
 * interferometry) and org.spindrift.shared.
 */
package org.spindrift.sim.run;
