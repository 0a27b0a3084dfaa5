/**
 * What the viewer needs from a run folder (through org.spindrift.shared.archive) and the
 * background snapshot reader.
 *
 * Dependencies: may import org.spindrift.shared.*.
 */
package org.spindrift.viewer.data;
