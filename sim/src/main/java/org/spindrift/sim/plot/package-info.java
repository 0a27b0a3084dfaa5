/**
 * What a plot that cannot be drawn does ({@code PlotGuard}): inside a run it is recorded and the
 * data are kept, elsewhere the failure goes through.
 *
 * Dependencies: none inside the project.
 */
package org.spindrift.sim.plot;
