package org.ritzwerk;

import java.util.Objects;

/**
 * Base of every failure Ritzwerk reports about its inputs or data: an unchecked exception with a
 * stable, machine-readable {@link #code() code} beside the human-readable message.
 *
 * <p>Plain precondition violations of programming errors (a {@code null} argument, an array of
 * the wrong length) use the JDK's own exception types instead.
 */
public class RitzwerkException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** The stable, machine-readable error code, e.g. {@code "quantity.unknown-unit"}. */
    private final String code;

    /**
     * @param code    stable error code, e.g. {@code "quantity.unknown-unit"}; not blank
     * @param message human-readable message naming what was wrong and where
     */
    public RitzwerkException(String code, String message) {
        super(message);
        this.code = requireCode(code);
    }

    /**
     * @param code    stable error code; not blank
     * @param message human-readable message
     * @param cause   the underlying failure
     */
    public RitzwerkException(String code, String message, Throwable cause) {
        super(message, cause);
        this.code = requireCode(code);
    }

    private static String requireCode(String code) {
        Objects.requireNonNull(code, "code");
        if (code.isBlank()) {
            throw new IllegalArgumentException("error code must not be blank");
        }
        return code;
    }

    /** @return the stable error code, suitable for tests and for programs that react to errors */
    public String code() {
        return code;
    }
}
