package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The command line is built with only the subcommand the arguments name (picocli reads every option of every
 * subcommand it is given, which took about 45 ms of start-up for all seven); arguments that name none get all of
 * them, so help, suggestions and errors are what they were.
 */
class SubcommandSelectionTest {
    private static final List<String> ALL = List.of("annotate", "simulate", "train", "model", "models", "demo",
            "evaluate");

    @Test
    void theListedSubcommandsAreTheCommandsInHelpOrderWithUniqueNames() {
        List<String> names = AnnotatorCommand.subcommands().stream()
                .map(c -> c.getAnnotation(Command.class).name()).toList();
        assertThat(names).containsExactlyElementsOf(ALL);
    }

    @Test
    void argumentsNamingASubcommandGetOnlyThatOne() {
        assertThat(subcommandsFor("annotate", "-m", "cpg-island", "in.fa")).containsExactly("annotate");
        assertThat(subcommandsFor("--debug", "model", "check", "cpg-island")).containsExactly("model");
        // the model's value is not taken for a subcommand: only the first word that is not an option counts
        assertThat(subcommandsFor("train", "-m", "annotate")).containsExactly("train");
    }

    @Test
    void argumentsNamingNoneGetAllInOrder() {
        assertThat(subcommandsFor()).containsExactlyElementsOf(ALL);
        assertThat(subcommandsFor("--help")).containsExactlyElementsOf(ALL);
        assertThat(subcommandsFor("annotat", "x")).containsExactlyElementsOf(ALL);
    }

    @Test
    void topLevelHelpListsEverySubcommand() {
        StringWriter out = new StringWriter();
        CommandLine cl = AnnotatorCommand.commandLine(streams(), new String[]{"--help"});
        cl.setOut(new PrintWriter(out, true));
        assertThat(cl.execute("--help")).isZero();
        for (String name : ALL) {
            assertThat(out.toString()).containsPattern("(?m)^\\s+" + name + "\\s");
        }
    }

    private static List<String> subcommandsFor(String... args) {
        return List.copyOf(AnnotatorCommand.commandLine(streams(), args).getSubcommands().keySet());
    }

    private static Streams streams() {
        return new Streams(new ByteArrayInputStream(new byte[0]), new ByteArrayOutputStream(),
                new PrintWriter(new StringWriter()));
    }
}
