/**
 * Sweeps of many tasks: plans, task kinds, local and Slurm array execution, status and
 * collection into CSV and HDF5.
 *
 * Dependencies: may import run, history, scenario and org.spindrift.shared.
 */
package org.spindrift.sim.sweep;
