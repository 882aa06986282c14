package org.ritzwerk.refdata;

import java.util.List;
import java.util.stream.Collectors;
import org.ritzwerk.RitzwerkException;

/**
 * A data file that was refused, with every problem found in it (not only the first).
 */
public final class DataFileException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the file has at least one bad line; see {@link #problems()}. */
    public static final String INVALID = "data.invalid";
    /** Code: the file is larger than the reader's limit. */
    public static final String TOO_LARGE = "data.too-large";
    /** Code: the file cannot be read at all. */
    public static final String UNREADABLE = "data.unreadable";

    private final transient List<DataProblem> problems;

    /**
     * @param code     one of the codes above
     * @param source   the file name or label
     * @param problems every problem found; may be empty for {@link #TOO_LARGE} and {@link #UNREADABLE}
     * @param summary  message when {@code problems} is empty
     */
    public DataFileException(String code, String source, List<DataProblem> problems, String summary) {
        super(code, message(source, problems, summary));
        this.problems = List.copyOf(problems);
    }

    /**
     * @param source the file name
     * @param cause  why it could not be read
     * @return an {@link #UNREADABLE} failure: "no such file" for a missing one, else the reason
     */
    public static DataFileException unreadable(String source, java.io.IOException cause) {
        String summary = cause instanceof java.nio.file.NoSuchFileException ? "no such file"
                : cause instanceof java.nio.file.AccessDeniedException ? "permission denied"
                : "cannot read: " + cause.getMessage();
        return new DataFileException(UNREADABLE, source, List.of(), summary);
    }

    private static String message(String source, List<DataProblem> problems, String summary) {
        if (problems.isEmpty()) {
            return source + ": " + summary;
        }
        return problems.size() + (problems.size() == 1 ? " problem" : " problems") + " in " + source + ":\n"
                + problems.stream().map(DataProblem::render).collect(Collectors.joining("\n"));
    }

    /** @return every problem found, in file order; immutable */
    public List<DataProblem> problems() {
        return problems;
    }
}
