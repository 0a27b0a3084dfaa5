/**
 * Light from the gas to a distant observer: camera, ray tracing (separated Mino-time and
 * general paths), the ray table, emission slices and frame rendering, beam and the beam-peak
 * astrometry (the position an instrument reports), moments, the light outputs, and the
 * compact-source model used by fits; single screen rays for checks ({@code ScreenProbe}) and the
 * Schwarzschild ray quadratures they compare with.
 *
 * Dependencies: may import history, plot, spacetime, motion and org.spindrift.shared; not the
 * scenario loaders or the run machinery (inputs arrive as values).
 */
package org.spindrift.sim.light;
