package org.spindrift.sim.scenario;

import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.sim.motion.ZamoFrame;
import org.spindrift.sim.spacetime.Spacetime;

/** Start of a centre given by orbit elements (p, e, inclination), through the motion engine's orbit solver. */
final class ElementsStart {
    private ElementsStart() {
    }

    static SourceSetup.Centre centre(CentreOrbit.Elements e, Spacetime st, ZamoFrame zamo) {
        throw new UserInputException("orbit.elements: the orbit-element solver is not available in this build yet");
    }
}
