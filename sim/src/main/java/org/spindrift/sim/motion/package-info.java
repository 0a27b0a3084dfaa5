/**
 * Test-mass motion: the geodesic equations ({@code GeodesicEquations}, a {@code BatchEquations}),
 * the batched DOP853 integrator that sees only that interface ({@code BatchIntegrator},
 * {@code ParticleStepper}), sign-change events located on the dense output
 * ({@code EventFunction}, {@code TurningPoints}), the particle state and its read-only views
 * ({@code ParticleBatch}, {@code Snapshot}, {@code ParticleView}), orbit set-up, orbit
 * measurement and the Hipparchus reference adapter ({@code HipparchusOde}).
 *
 * <p>May import: {@code sim.spacetime}, {@code sim.numerics}, {@code shared} (user-input errors)
 * and Hipparchus; nothing about scenarios, runs, light or analysis.
 */
package org.spindrift.sim.motion;
