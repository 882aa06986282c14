package org.ritzwerk.provenance;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Finds lines that name a software repository or a commit as the source of something: the project
 * cites publications, handbooks, standard databases and reference libraries with their versions,
 * never a repository or a commit of one.
 *
 * <p>Generic patterns only (no project is named here):
 * <ul>
 *   <li>{@code at commit} followed by 7 to 40 hex digits;</li>
 *   <li>{@code commit} followed by a full 40-hex-digit id (also {@code commit: <id>},
 *       {@code commit=<id>});</li>
 *   <li>an address on a public code-hosting service;</li>
 *   <li>an {@code owner/name} pair (not part of a longer path, not a folder of this project)
 *       within 60 characters of the word repository, repo or commit on the same line.</li>
 * </ul>
 * A checksum (e.g. a sha256 of 64 hex digits) or a DOI does not match. Stateless and thread-safe.
 */
final class RepositorySourceGuard {

    /** One match in a line: the rule and the text it matched. */
    record Match(String rule, String text) {
    }

    /** One line that matched. */
    record Finding(String file, int line, String rule, String matched, String text) {

        @Override
        public String toString() {
            return file + ":" + line + ": " + rule + ": '" + matched + "' in: " + text.strip();
        }
    }

    /** Hex id of 7 to 40 digits holding at least one decimal digit (so English words such as "defaced" pass). */
    private static final String SHORT_ID = "(?=[0-9a-f]{0,39}[0-9])[0-9a-f]{7,40}(?![0-9a-z])";
    private static final Pattern AT_COMMIT = Pattern.compile(
            "\\bat\\s+(?:the\\s+)?commit\\s*[:#=]?\\s*" + SHORT_ID, Pattern.CASE_INSENSITIVE);
    private static final Pattern FULL_COMMIT = Pattern.compile(
            "\\bcommit(?:\\s+id|\\s+hash)?\\s*[:#=(]?\\s*[0-9a-f]{40}(?![0-9a-z])", Pattern.CASE_INSENSITIVE);
    private static final Pattern HOSTING = Pattern.compile(
            "(?<![a-z0-9-])(?:[a-z0-9-]+\\.)*(?:github\\.com|githubusercontent\\.com|gitlab\\.com|bitbucket\\.org"
                    + "|sourceforge\\.net|codeberg\\.org)\\b(?:/[^\\s)\\]\"'>,;]*)?",
            Pattern.CASE_INSENSITIVE);
    private static final Pattern REPOSITORY_WORD = Pattern.compile("\\b(?:repository|repositories|repo|repos|commit)\\b",
            Pattern.CASE_INSENSITIVE);
    /** owner/name standing alone: not inside a path, an address, a fraction or a unit. */
    private static final Pattern OWNER_NAME = Pattern.compile(
            "(?<![\\w./:@~-])([A-Za-z0-9](?:[A-Za-z0-9-]{0,38}))/([A-Za-z0-9_.-]{2,100})(?![\\w/-])");
    /** Largest distance, in characters, between the pair and such a word. */
    private static final int NEAR = 60;
    private static final Set<String> NOT_REPOSITORIES = Set.of("and/or", "either/or", "read/write", "input/output",
            "true/false", "yes/no", "on/off", "n/a", "w/o");

    private final Set<String> localFolders;

    /**
     * @param localFolders top-level folder names of this project (e.g. {@code api}, {@code engine}):
     *                     {@code api/src} is a path here, not a repository
     */
    RepositorySourceGuard(Set<String> localFolders) {
        this.localFolders = Set.copyOf(localFolders);
    }

    /**
     * @param file  the file's name, for the findings
     * @param lines the file's lines
     * @return every finding, in line order
     */
    List<Finding> scan(String file, List<String> lines) {
        List<Finding> findings = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String text = lines.get(i);
            for (Match match : matches(text)) {
                findings.add(new Finding(file, i + 1, match.rule(), match.text(), text));
            }
        }
        return findings;
    }

    /**
     * @param text one line
     * @return each match (empty when the line is clean)
     */
    List<Match> matches(String text) {
        List<Match> found = new ArrayList<>();
        add(found, "commit named as a source", AT_COMMIT.matcher(text));
        add(found, "commit id", FULL_COMMIT.matcher(text));
        add(found, "code-hosting address", HOSTING.matcher(text));
        if (REPOSITORY_WORD.matcher(text).find()) {
            Matcher m = OWNER_NAME.matcher(text);
            while (m.find()) {
                int from = Math.max(0, m.start() - NEAR);
                int to = Math.min(text.length(), m.end() + NEAR);
                if (!REPOSITORY_WORD.matcher(text.substring(from, to)).find()) {
                    continue; // the word is elsewhere in a long line
                }
                String pair = m.group();
                String owner = m.group(1);
                String name = m.group(2);
                if (NOT_REPOSITORIES.contains(pair.toLowerCase(Locale.ROOT)) || localFolders.contains(owner)
                        || !owner.matches(".*[A-Za-z].*") || !name.matches(".*[A-Za-z].*")
                        || name.matches("[A-Za-z]{1,3}\\d?") && owner.matches("[A-Za-z]{1,3}\\d?")) {
                    continue; // a unit (km/s), a fraction, or a path inside this project
                }
                found.add(new Match("repository named beside a repository word", pair));
            }
        }
        return found;
    }

    private static void add(List<Match> found, String rule, Matcher m) {
        while (m.find()) {
            found.add(new Match(rule, m.group()));
        }
    }
}
