/**
 * Units and physical constants, sky coordinates, the code version, the user-error type and the
 * command plug-in interface shared by every module.
 *
 * Dependencies: Imports nothing of the project.
 */
package org.spindrift.shared;
