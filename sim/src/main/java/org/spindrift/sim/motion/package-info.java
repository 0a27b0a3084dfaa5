/**
 * Geodesic motion of test particles: Hamilton's equations, the batched Dormand-Prince 8(5,3)
 * integrator, orbit set-up (circular, elements, local velocity), end states, turning points,
 * diagnostics and exact Mino-time frequencies.
 *
 * Dependencies: may import spacetime and org.spindrift.shared.
 */
package org.spindrift.sim.motion;
