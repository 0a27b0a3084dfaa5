/**
 * Small numerical tools shared by the physics packages: the one bracketed root finder
 * ({@link org.spindrift.sim.numerics.BracketedRoot}). Owns no physics; imports only the JDK and
 * Hipparchus, so every engine package may use it.
 */
package org.spindrift.sim.numerics;
