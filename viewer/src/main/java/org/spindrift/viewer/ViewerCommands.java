package org.spindrift.viewer;

import org.spindrift.shared.SubcommandProvider;

/** Registers {@code view} with the spindrift command line (META-INF/services). */
public final class ViewerCommands implements SubcommandProvider {
    @Override public String name() {
        return "view";
    }

    @Override public Object command() {
        return new ViewCommand();
    }
}
