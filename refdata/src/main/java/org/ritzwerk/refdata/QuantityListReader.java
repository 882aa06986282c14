package org.ritzwerk.refdata;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.quantity.Quantity;
import org.ritzwerk.quantity.QuantityParseException;
import org.ritzwerk.quantity.QuantityText;

/**
 * Reads a list of quantities, one per line in the text form of {@link QuantityText}
 * ({@code 656.28(2) nm air}); blank lines and lines starting with {@code #} are comments.
 *
 * <p>Every line is either read or reported: the whole file is read, every bad line becomes a
 * {@link DataProblem}, and if there is any, a {@link DataFileException} carries them all and no
 * partial list is returned. At most {@link #MAX_LINES} lines and {@link #MAX_LINE_LENGTH}
 * characters per line are read. Stateless and thread-safe.
 */
public final class QuantityListReader {

    /** The most lines a list may have. */
    public static final int MAX_LINES = 1_000_000;
    /** The longest line, in characters. */
    public static final int MAX_LINE_LENGTH = 1000;

    private final QuantityText text;

    /** @param text the quantity reader, which fixes what "air" means */
    public QuantityListReader(QuantityText text) {
        this.text = Objects.requireNonNull(text, "text");
    }

    /**
     * One quantity as read, with the line it came from.
     *
     * @param line     1-based line number
     * @param raw      the line as written
     * @param quantity the quantity
     */
    public record Entry(int line, String raw, Quantity quantity) {
    }

    /**
     * Reads a list file: strict UTF-8 (a bad byte is reported with its line and column), at most
     * {@link TabularFiles#MAX_BYTES} bytes; a folder or a missing file is refused naming the path.
     *
     * @param file the list file
     * @return every entry, in file order
     * @throws DataFileException with every problem found
     */
    public List<Entry> read(java.nio.file.Path file) {
        return read(new java.io.StringReader(TabularFiles.read(file)), file.toString());
    }

    /**
     * @param input  the text; read to the end, not closed
     * @param source file name or label for messages
     * @return the entries in file order
     * @throws DataFileException with every problem, when any line is bad or the input too large
     */
    public List<Entry> read(Reader input, String source) {
        BufferedReader lines = input instanceof BufferedReader ? (BufferedReader) input : new BufferedReader(input);
        List<Entry> entries = new ArrayList<>();
        List<DataProblem> problems = new ArrayList<>();
        int number = 0;
        try {
            for (String raw = lines.readLine(); raw != null; raw = lines.readLine()) {
                number++;
                if (number > MAX_LINES) {
                    throw new DataFileException(DataFileException.TOO_LARGE, source, List.of(),
                            "more than " + MAX_LINES + " lines; split the list");
                }
                if (raw.length() > MAX_LINE_LENGTH) {
                    problems.add(new DataProblem(source, number, 0, DataFileException.TOO_LARGE,
                            "line longer than " + MAX_LINE_LENGTH + " characters",
                            raw.substring(0, 80) + "..."));
                    continue;
                }
                String content = raw.strip();
                if (content.isEmpty() || content.startsWith("#")) {
                    continue;
                }
                try {
                    entries.add(new Entry(number, raw, text.parse(raw)));
                } catch (QuantityParseException e) {
                    problems.add(new DataProblem(source, number, e.column(), e.code(), reasonOf(e), raw));
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(source + ": " + e.getMessage(), e);
        }
        if (!problems.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, problems, "");
        }
        return List.copyOf(entries);
    }

    /** The parse message without its quoted input, which the problem shows as the raw line. */
    private static String reasonOf(QuantityParseException e) {
        String message = e.getMessage();
        int colon = message.indexOf("): ");
        return colon >= 0 ? message.substring(colon + 3) : message;
    }
}
