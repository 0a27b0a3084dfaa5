/**
 * The project's colour ramps (SKY, GREY, RATIO), built in Oklab, used by the plots and the
 * viewer.
 *
 * Dependencies: Imports nothing of the project.
 */
package org.spindrift.shared.colour;
