package org.spindrift.sim.cli;

import org.spindrift.shared.SubcommandProvider;

/** Registers {@code orbit}. */
public final class OrbitCommandProvider implements SubcommandProvider {
    @Override public String name() {
        return "orbit";
    }

    @Override public Object command() {
        return new OrbitCommand();
    }
}
