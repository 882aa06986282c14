package org.ritzwerk.provenance;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The guard's pattern matcher on lines that must and must not be flagged. The flagged examples
 * are assembled from pieces so that this file does not itself hold a flagged line; every name in
 * them is made up.
 */
class RepositorySourceGuardTest {

    private static final RepositorySourceGuard GUARD = new RepositorySourceGuard(Set.of("api", "engine", "refdata"));
    private static final String C_WORD = "com" + "mit";
    private static final String HOST = "git" + "hub.com";
    /** An invented 40-digit hex id. */
    private static final String FULL_ID = "0123456789abcdef0123456789abcdef" + "fedcba98";

    @Test
    void flagsCommitsNamedAsSources() {
        flagged("values taken from a copy at " + C_WORD + " 0f1e2d3", "commit named as a source");
        flagged("taken from table.txt at " + C_WORD + " " + FULL_ID + " (invented)", "commit named as a source");
        flagged("copied at the " + C_WORD + ": 1a2b3c4d", "commit named as a source");
        flagged("transcribed from table.csv (" + C_WORD + " " + FULL_ID + ")", "commit id");
        flagged(C_WORD + "=" + FULL_ID.toUpperCase(), "commit id");
    }

    @Test
    void flagsCodeHostingAddresses() {
        flagged("see https://" + HOST + "/someone/some-tool/blob/main/data.csv", "code-hosting address");
        flagged("raw." + "githubuser" + "content.com/someone/x/main/y.txt", "code-hosting address");
        flagged("mirror: git" + "lab.com/group/project", "code-hosting address");
        flagged("bit" + "bucket.org/team/repo", "code-hosting address");
        flagged("https://source" + "forge.net/projects/something/", "code-hosting address");
        flagged("code" + "berg.org/owner/name", "code-hosting address");
        flagged("www." + HOST.toUpperCase(), "code-hosting address");
    }

    @Test
    void flagsOwnerSlashNameBesideARepositoryWord() {
        flagged("from the public CSV example-org" + "/line-tables, file x.csv (" + C_WORD + " unknown)",
                "repository named beside a repository word");
        flagged("see the repo" + "sitory someone" + "/SomeTool for details", "repository named beside a repository word");
        flagged("copied from the repo someone" + "/some_tool.", "repository named beside a repository word");
    }

    @Test
    void passesChecksumsDoisPathsAndProse() {
        clean("a library file's sha256 " + FULL_ID + FULL_ID.substring(0, 24) + " (64 hex digits, invented)");
        clean("sha1 of the Debian file: " + FULL_ID);
        clean("E. Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021), doi:10.1103/RevModPhys.93.025010");
        clean("https://doi.org/10.1088/1674-1137/abddaf (AME2020, Chin. Phys. C 45, 030003)");
        clean("/usr/share/bodr/elements.xml of the Debian package bodr 10-2 (Blue Obelisk Data Repository 10)");
        clean("Commit in small steps with honest messages; do not " + C_WORD + " generated files by hand.");
        clean("run from the repository root: api/src/test/resources/golden/make_golden.py");
        clean("velocities in km/s and/or m/s; the repository keeps j = 1/2 and 3/2 levels");
        clean("the repository holds this text, and much further along the same line, far from that word, "
                + "a double/unresolved flag");
        clean("the " + C_WORD + " defaced the table (a word, not an id)");
        clean("Debian packages python3-mpmath 1.2.1-2, python3-numpy 1:1.24.2-1+deb12u1");
        clean("an id alone is not a source: " + FULL_ID);
        clean("https://physics.nist.gov/PhysRefData/Handbook/Tables/neontable2.htm");
    }

    @Test
    void findingsNameFileLineAndMatchedText() {
        List<RepositorySourceGuard.Finding> findings = GUARD.scan("x.csv",
                List.of("# clean line", "# source: copy at " + C_WORD + " abcdef1234"));
        assertEquals(1, findings.size(), findings.toString());
        RepositorySourceGuard.Finding finding = findings.get(0);
        assertEquals(2, finding.line());
        assertEquals("at " + C_WORD + " abcdef1234", finding.matched());
        assertTrue(finding.toString().startsWith("x.csv:2: commit named as a source: 'at " + C_WORD),
                finding.toString());
    }

    private static void flagged(String line, String rule) {
        List<RepositorySourceGuard.Match> matches = GUARD.matches(line);
        assertTrue(matches.stream().anyMatch(m -> m.rule().equals(rule)),
                () -> "expected '" + rule + "' in: " + line + "; got " + matches);
    }

    private static void clean(String line) {
        List<RepositorySourceGuard.Match> matches = GUARD.matches(line);
        assertTrue(matches.isEmpty(), () -> "expected no match in: " + line + "; got " + matches);
    }
}
