/**
 * The OpenGL replay viewer and its view command; reads only a run folder through
 * org.spindrift.shared.archive.
 *
 * Dependencies: may import org.spindrift.shared.*, never sim.
 */
package org.spindrift.viewer;
