package org.spindrift.shared.scenario;

/**
 * The distant observer: inclination of the line of sight from the spin axis and position angle of the projected spin axis on the sky.
 *
 * @param inclinationDeg angle between the spin axis and the line of sight, 0..180 degrees
 * @param positionAngleDeg position angle of the projected spin axis, from north through east, degrees
 */
public record Observer(double inclinationDeg, double positionAngleDeg) {
}
