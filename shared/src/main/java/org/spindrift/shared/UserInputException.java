package org.spindrift.shared;

/**
 * Bad input from the user (a command-line option, a scenario file, a run folder). The command
 * line prints the message as one line and exits with status 2; no stack trace.
 * Messages name where the problem is (file, key or option) and the allowed range.
 */
public class UserInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public UserInputException(String message) {
        super(message);
    }

    public UserInputException(String message, Throwable cause) {
        super(message, cause);
    }
}
