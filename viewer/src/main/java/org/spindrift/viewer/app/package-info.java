/**
 * The viewer session, window, frame composition, frame export, playback clock and benchmark.
 *
 * Dependencies: may import the other viewer packages and org.spindrift.shared.*.
 */
package org.spindrift.viewer.app;
