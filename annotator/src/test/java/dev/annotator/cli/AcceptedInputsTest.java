package dev.annotator.cli;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelJson;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Inputs that look odd but are valid and must work, each through the command line: the output must be exactly
 * that of the plain form of the same data.
 */
class AcceptedInputsTest {
    @TempDir
    Path dir;

    private byte[] annotate(Path input, String... model) {
        String[] args = model.length == 0 ? new String[] {"annotate", "-q", "-m", "cpg-island", input.toString()}
                : new String[] {"annotate", "-q", "-m", model[0], input.toString()};
        CliRun.Result r = CliRun.run(args);
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();
        return r.stdout();
    }

    @Test
    void crlfLineEndsAndAMissingFinalNewlineGiveTheSameOutput() throws IOException {
        String lf = new String(TestInputs.randomFasta(3, 20_000, 21), StandardCharsets.US_ASCII);
        byte[] expected = annotate(Files.writeString(dir.resolve("lf.fa"), lf));
        assertThat(expected).isNotEmpty();
        String crlfText = lf.replace("\n", "\r\n");
        Path crlf = Files.writeString(dir.resolve("crlf.fa"), crlfText);
        Path noFinal = Files.writeString(dir.resolve("no-final.fa"), lf.substring(0, lf.length() - 1));
        Path both = Files.writeString(dir.resolve("both.fa"), crlfText.substring(0, crlfText.length() - 2));
        assertThat(Files.readString(both)).doesNotEndWith("\n").doesNotEndWith("\r");
        for (Path p : List.of(crlf, noFinal, both)) {
            assertThat(annotate(p)).as(p.getFileName().toString()).isEqualTo(expected);
        }
    }

    @Test
    void aLineOfTwelveMegabytesReadsLikeTheWrappedRecord() throws IOException {
        // one record on a single line, as some assemblers write chromosomes; over the 10 MB the hardening issue names
        byte[] wrapped = TestInputs.randomFasta(1, 12_000_000, 8);
        String text = new String(wrapped, StandardCharsets.US_ASCII);
        int firstNewline = text.indexOf('\n');
        String oneLine = text.substring(0, firstNewline + 1) + text.substring(firstNewline + 1).replace("\n", "")
                + "\n";
        assertThat(oneLine.lines().skip(1).findFirst().orElseThrow()).hasSize(12_000_000);
        Path a = Files.write(dir.resolve("wrapped.fa"), wrapped);
        Path b = Files.writeString(dir.resolve("one-line.fa"), oneLine);
        assertThat(annotate(b)).isEqualTo(annotate(a));
    }

    @Test
    void recordsWithoutBasesAreWarnedAboutAndSkipped() throws IOException {
        String two = new String(TestInputs.randomFasta(2, 5_000, 3), StandardCharsets.US_ASCII);
        int second = two.indexOf(">rand2");
        String withEmpty = ">first-empty\n" + two.substring(0, second) + ">middle-empty described\n\n"
                + two.substring(second) + ">last-empty";
        Path input = Files.writeString(dir.resolve("holes.fa"), withEmpty);
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", input.toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        long middleLine = withEmpty.substring(0, withEmpty.indexOf(">middle")).chars().filter(c -> c == '\n').count()
                + 1;
        long lastLine = withEmpty.chars().filter(c -> c == '\n').count() + 1;
        assertThat(r.errLines()).startsWith(
                "annotator: warning: " + input + ":1: record first-empty has no sequence; skipped",
                "annotator: warning: " + input + ":" + middleLine + ": record middle-empty has no sequence; skipped",
                "annotator: warning: " + input + ":" + lastLine + ": record last-empty has no sequence; skipped");
        assertThat(r.errLines()).hasSize(4); // and the summary line
        assertThat(r.stdout()).isEqualTo(annotate(Files.writeString(dir.resolve("plain.fa"), two)));
    }

    /**
     * A record shorter than the model's order: every base has fewer preceding bases than the order, so only the
     * reduced tables are used. DEVELOPERS.md: the order-j table averages out the oldest context base with equal
     * weights, so the order-0 table of an order-3 state is the plain mean of its 64 rows; for one base the label's
     * posterior is then start x emission over the sum of both states' products (Bayes' rule).
     */
    @Test
    void recordsShorterThanTheModelOrder() throws IOException {
        double[] hot = new double[64 * 4];
        double meanC = 0;
        for (int row = 0; row < 64; row++) {
            double c = row % 3 == 0 ? 0.7 : 0.3;
            double[] p = {0.1, c, 0.2, 0.7 - c};
            System.arraycopy(p, 0, hot, row * 4, 4);
            meanC += c / 64;
        }
        double[] cold = {0.3, 0.2, 0.2, 0.3};
        HmmModel model = new HmmModel("order-three", "an invented model with one order-3 state",
                new Provenance("invented for tests", List.of()),
                List.of(new Label("rich", "region", "SO:0000001", false, false),
                        new Label("plain", null, null, true, false)),
                List.of(new State("hot", "rich", 3, hot), new State("cold", "plain", 0, cold)),
                new double[] {0.5, 0.5},
                List.of(new Transition("hot", "hot", 0.9), new Transition("hot", "cold", 0.1),
                        new Transition("cold", "cold", 0.9), new Transition("cold", "hot", 0.1)));
        Path modelFile = dir.resolve("order-three.json");
        try (OutputStream out = Files.newOutputStream(modelFile)) {
            ModelJson.write(model, out);
        }
        Path input = Files.writeString(dir.resolve("short.fa"), ">one\nC\n>two\nCG\n>three\nCGA\n");
        String gff = new String(annotate(input, modelFile.toString()), StandardCharsets.UTF_8);

        assertThat(gff.lines().filter(l -> l.startsWith("##sequence-region")))
                .containsExactly("##sequence-region one 1 1", "##sequence-region two 1 2", "##sequence-region three 1 3");
        double posterior = 0.5 * meanC / (0.5 * meanC + 0.5 * cold[1]);
        assertThat(posterior).isGreaterThan(0.5);
        String expected = String.format(Locale.ROOT, "one\tannotator\tregion\t1\t1\t%.3f\t.\t.\t", posterior);
        assertThat(gff.lines().filter(l -> l.startsWith("one\t"))).singleElement().asString().startsWith(expected);
    }
}
