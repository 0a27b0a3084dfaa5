/**
 * Metric families (Kerr and the mass-function family, Johannsen-Psaltis), their analytic
 * derivatives, horizons, circular orbits and landmarks (ISCO, photon orbits, capture radius),
 * and allocation-free trigonometry.
 *
 * Dependencies: may import numerics and org.spindrift.shared only.
 */
package org.spindrift.sim.spacetime;
