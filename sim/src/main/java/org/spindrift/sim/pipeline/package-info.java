/**
 * The stages of a run after the evolution, as adapters between the run's context and the physics
 * packages: snapshots.h5, the analysis, the light stage, the interferometry stage and the plots
 * (one class per figure). Stages hand their products to later ones through typed slots
 * ({@code StageResults}). Sits above history, scenario, light, analysis and interferometry and
 * may import them; nothing below imports it.
 */
package org.spindrift.sim.pipeline;
