package org.spindrift.sim.cli;

import org.spindrift.shared.SubcommandProvider;

/** Registers {@code bench}. */
public final class BenchCommandProvider implements SubcommandProvider {
    @Override public String name() {
        return "bench";
    }

    @Override public Object command() {
        return new BenchCommand();
    }
}
