/**
 * The stages of a run after the evolution, as adapters between the run's context and the physics
 * packages: snapshots.h5, the analysis, the light stage, the interferometry stage and the plots
 * (one class per figure). Stages hand their products to later ones through typed slots
 * ({@code StageResults}); run notes (warnings, plots not drawn) go to the manifest.
 *
 * Dependencies: may import history, scenario, light, analysis, interferometry, plot, motion,
 * spacetime and org.spindrift.shared; not the run machinery.
 */
package org.spindrift.sim.pipeline;
