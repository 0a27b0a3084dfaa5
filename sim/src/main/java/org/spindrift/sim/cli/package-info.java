/**
 * The command line: picocli commands (run, check, fit, distinguish, sweep, verify, landmarks,
 * orbit, bench) and the entry point Main.
 *
 * Dependencies: may import every sim package and org.spindrift.shared.
 */
package org.spindrift.sim.cli;
