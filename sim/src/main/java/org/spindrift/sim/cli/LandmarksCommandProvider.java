package org.spindrift.sim.cli;

import org.spindrift.shared.SubcommandProvider;

/** Registers {@code landmarks}. */
public final class LandmarksCommandProvider implements SubcommandProvider {
    @Override public String name() {
        return "landmarks";
    }

    @Override public Object command() {
        return new LandmarksCommand();
    }
}
