package org.spindrift.validation;

import org.spindrift.shared.SubcommandProvider;

/** Registers {@code validate}. */
public final class ValidateCommandProvider implements SubcommandProvider {
    @Override public String name() {
        return "validate";
    }

    @Override public Object command() {
        return new ValidateCommand();
    }
}
