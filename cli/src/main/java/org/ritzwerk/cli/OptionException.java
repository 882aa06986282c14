package org.ritzwerk.cli;

import org.ritzwerk.RitzwerkException;

/**
 * A command-line option, argument or combination the command refuses: bad input, exit code 2,
 * the message naming the option. Every refusal the command line itself makes is one of these;
 * an {@link IllegalArgumentException} that escapes a command is a broken precondition (a bug,
 * exit code 1), never bad input.
 */
final class OptionException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** The error code of every option refusal. */
    static final String CODE = "cli.option";

    /** @param message what was wrong, naming the option */
    OptionException(String message) {
        super(CODE, message);
    }

    /**
     * @param message what was wrong, naming the option
     * @param cause   the library's refusal of the option's value
     */
    OptionException(String message, Throwable cause) {
        super(CODE, message, cause);
    }
}
