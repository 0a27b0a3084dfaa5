/**
 * Numerical tools shared by the physics packages, with no physics of their own: the one
 * bracketed root finder ({@code BracketedRoot}: allocation-free bisection for event functions on
 * an integrator's dense output, Hipparchus' bracketing Brent solver for expensive functions).
 *
 * Dependencies: the JDK and Hipparchus only; every engine package may import it.
 */
package org.spindrift.sim.numerics;
