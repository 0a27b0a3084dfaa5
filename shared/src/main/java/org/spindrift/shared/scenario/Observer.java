package org.spindrift.shared.scenario;

/**
 * The distant observer (DESIGN section 3).
 *
 * @param inclinationDeg angle between the spin axis and the line of sight, 0..180 degrees
 * @param positionAngleDeg position angle of the projected spin axis, from north through east, degrees
 */
public record Observer(double inclinationDeg, double positionAngleDeg) {
}
