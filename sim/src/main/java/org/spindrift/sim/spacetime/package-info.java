/**
 * Spacetimes: the metric families ({@code Spacetime}, {@code MassFunctionSpacetime},
 * {@code JohannsenPsaltisSpacetime}) with analytic first derivatives, their construction from a
 * family name ({@code Spacetimes}), circular orbits, horizons and landmarks, and the
 * allocation-free {@code Trig}.
 *
 * <p>May import: {@code sim.numerics}, {@code shared} and Hipparchus; no other engine package
 * (everything else builds on this one).
 */
package org.spindrift.sim.spacetime;
