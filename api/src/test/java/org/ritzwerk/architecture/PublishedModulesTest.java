package org.ritzwerk.architecture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The BOM (bom/pom.xml) has no parent, so its version, its list of modules and its metadata are
 * kept in step with the parent pom by hand; this test fails when they drift apart.
 */
class PublishedModulesTest {

    private static final List<String> PUBLISHED =
            List.of("ritzwerk-api", "ritzwerk-engine", "ritzwerk-refdata", "ritzwerk-cli", "ritzwerk-spark");

    @Test
    void theBomPinsEveryPublishedModuleAtTheProjectVersion() {
        String bom = ModuleSources.text("bom/pom.xml");
        String managed = between(bom, "<dependencyManagement>", "</dependencyManagement>");
        Matcher dependency = Pattern.compile(
                "<dependency>\\s*<groupId>org\\.ritzwerk</groupId>\\s*<artifactId>([\\w-]+)</artifactId>\\s*"
                        + "<version>([^<]+)</version>\\s*</dependency>").matcher(managed);
        List<String> artifacts = new ArrayList<>();
        while (dependency.find()) {
            artifacts.add(dependency.group(1));
            assertEquals("${project.version}", dependency.group(2), "bom/pom.xml: version of " + dependency.group(1));
        }
        assertEquals(PUBLISHED, artifacts, "bom/pom.xml: managed modules");
        assertEquals(projectVersion(ModuleSources.text("pom.xml")), projectVersion(bom), "bom/pom.xml: version");
    }

    @Test
    void theBomCarriesTheParentsMetadata() {
        String parent = ModuleSources.text("pom.xml");
        String bom = ModuleSources.text("bom/pom.xml");
        for (String property : List.of("ritzwerk.site", "ritzwerk.scm", "ritzwerk.issues",
                "project.build.outputTimestamp", "gpg-plugin.version", "install-plugin.version",
                "deploy-plugin.version")) {
            assertEquals(property(parent, property), property(bom, property), "bom/pom.xml: property " + property);
        }
        assertTrue(ModuleSources.text("pom.xml").contains("<module>bom</module>"), "pom.xml: bom is a module");
    }

    private static String projectVersion(String pom) {
        String withoutParent = pom.replaceAll("(?s)<parent>.*?</parent>", "");
        Matcher version = Pattern.compile("</artifactId>\\s*<version>([^<]+)</version>").matcher(withoutParent);
        assertTrue(version.find(), "no project version");
        return version.group(1);
    }

    private static String property(String pom, String name) {
        Matcher value = Pattern.compile("<" + Pattern.quote(name) + ">([^<]*)</" + Pattern.quote(name) + ">")
                .matcher(between(pom, "<properties>", "</properties>"));
        assertTrue(value.find(), "no property " + name);
        return value.group(1);
    }

    private static String between(String text, String start, String end) {
        int from = text.indexOf(start);
        int to = text.indexOf(end, from);
        assertTrue(from >= 0 && to > from, "no " + start + " ... " + end);
        return text.substring(from, to);
    }
}
