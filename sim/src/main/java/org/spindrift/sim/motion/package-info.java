/**
 * Geodesic motion of test particles: Hamilton's equations ({@code GeodesicEquations}, a
 * {@code BatchEquations}), the batched Dormand-Prince 8(5,3) integrator that sees only that
 * interface, sign-change events located on the dense output ({@code EventFunction}: capture,
 * escape, turning points), the particle state and its read-only view ({@code ParticleView}),
 * orbit set-up (circular, elements, local velocity, the Gaussian {@code ParticleBall}), end
 * states, diagnostics, exact Mino-time frequencies and the Hipparchus reference adapter
 * ({@code HipparchusOde}).
 *
 * Dependencies: may import numerics, spacetime and org.spindrift.shared.
 */
package org.spindrift.sim.motion;
