package org.spindrift.shared;

/**
 * A command-line subcommand contributed by a module (found with {@link java.util.ServiceLoader}).
 * The engine's command line lives in {@code sim}; modules that {@code sim} must not depend on
 * ({@code viewer}, {@code validation}) add their commands through this interface, so that
 * {@code ./spindrift --help} lists every command.
 */
public interface SubcommandProvider {
    /** @return the subcommand name, for example {@code view} */
    String name();

    /** @return a fresh picocli command object (annotated with {@code @Command}) */
    Object command();
}
