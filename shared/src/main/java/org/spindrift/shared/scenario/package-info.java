/**
 * Immutable records of a parsed scenario (black hole, observer, sources, run, imaging,
 * instrument, interferometer) and their JSON echo.
 *
 * Dependencies: may import org.spindrift.shared only.
 */
package org.spindrift.shared.scenario;
