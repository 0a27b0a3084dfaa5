package org.spindrift.viewer.gl;

import org.spindrift.shared.UserInputException;

/**
 * No display, or no OpenGL 3.3 core context on it. The command line prints the one-line message
 * (which says how to run the viewer instead) and exits with status 2.
 */
public final class DisplayUnavailableException extends UserInputException {
    private static final long serialVersionUID = 1L;

    /** How to get a usable OpenGL context, appended to every message. */
    public static final String HOW_TO = "run it in a desktop session, or under a virtual X server:"
            + " xvfb-run -a ./spindrift view ...";

    public DisplayUnavailableException(String what) {
        super(what + "; " + HOW_TO);
    }
}
