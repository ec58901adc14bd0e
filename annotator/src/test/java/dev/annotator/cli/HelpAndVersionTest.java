package dev.annotator.cli;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;

class HelpAndVersionTest {

    @ParameterizedTest(name = "annotator {0} --help")
    @ValueSource(strings = {"", "annotate", "simulate", "train", "model", "model check", "models", "demo", "evaluate"})
    void everyHelpHasExamplesAndTheResearchUseCaution(String command) {
        CliRun.Result r = CliRun.run(args(command, "--help"));
        assertThat(r.status()).isZero();
        assertThat(r.stderr()).isEmpty();
        String help = r.out();
        assertThat(help).startsWith("Usage: annotator" + (command.isEmpty() ? "" : " " + command));
        // help wraps at 80 columns, so compare the caution with line breaks folded
        assertThat(help.replaceAll("\\s+", " ")).contains("not for clinical or diagnostic decisions");

        List<String> lines = help.lines().toList();
        int start = lines.indexOf("Examples:");
        assertThat(start).as("an 'Examples:' section").isNotNegative();
        List<String> examples = lines.subList(start + 1, lines.size()).stream().takeWhile(l -> !l.isBlank()).toList();
        assertThat(examples).isNotEmpty();
        // an example wrapped by the help formatter restarts at column 0, inside a word, and cannot be pasted
        assertThat(examples).allMatch(l -> l.startsWith("  "));
        assertThat(examples).allMatch(l -> l.length() <= 80);
        // each starts with the command it documents (or feeds it through a pipe)
        assertThat(examples.stream().filter(l -> !l.startsWith("      ")))
                .allMatch(l -> l.contains("annotator " + command));
    }

    @Test
    void versionPrintsTheProjectVersion() throws IOException {
        CliRun.Result r = CliRun.run("--version");
        assertThat(r.status()).isZero();
        assertThat(r.stderr()).isEmpty();
        // the version stamped at build time is the one in the module's pom (its <parent> block)
        String pom = Files.readString(Path.of(System.getProperty("basedir", "."), "pom.xml"));
        Matcher m = Pattern.compile("<parent>.*?<version>([^<]+)</version>", Pattern.DOTALL).matcher(pom);
        assertThat(m.find()).isTrue();
        assertThat(r.out()).isEqualTo("annotator " + m.group(1) + "\n");
        assertThat(CliRun.run("annotate", "--version").out()).isEqualTo(r.out());
    }

    private static String[] args(String command, String last) {
        String joined = command.isEmpty() ? last : command + " " + last;
        return joined.split(" ");
    }
}
