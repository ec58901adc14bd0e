package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import static org.assertj.core.api.Assertions.assertThat;

class DemoCommandTest {
    @TempDir
    Path dir;

    @Test
    void writesItsFilesAndATableThatTheFilesBearOut() throws IOException {
        Path out = dir.resolve("demo"); // not there yet: the command creates it
        CliRun.Result r = CliRun.run("demo", "--out", out.toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();

        Path fasta = out.resolve("screening-batch.fa");
        Path truth = out.resolve("screening-batch.truth.gff3");
        Path predicted = out.resolve("screening-batch.predicted.gff3");
        try (var files = Files.list(out)) {
            assertThat(files).containsExactlyInAnyOrder(fasta, truth, predicted);
        }
        assertThat(Files.readString(fasta)).startsWith(">construct01");

        List<String> lines = r.out().lines().toList();
        int header = lines.indexOf(lines.stream().filter(l -> l.startsWith("record ")).findFirst().orElseThrow());
        List<String> table = lines.subList(header + 1, lines.size()).stream().takeWhile(l -> !l.isBlank()).toList();
        String all = table.get(table.size() - 1);
        assertThat(all).startsWith("all ");
        String[] cols = all.split("\\s+"); // all, length, planted, called, recall, precision, median_bnd_err
        double recall = Double.parseDouble(cols[4]);
        assertThat(recall).isGreaterThanOrEqualTo(0.9);

        // recount from the files: planted islands of at least 200 bp (Gardiner-Garden & Frommer 1987 minimum, as
        // the demo's help says) overlapped by a predicted one
        GffCalls planted = GffCalls.parse(Files.readAllBytes(truth));
        GffCalls called = GffCalls.parse(Files.readAllBytes(predicted));
        List<GffCalls.Call> counted = planted.calls().stream().filter(c -> c.length() >= 200).toList();
        long found = counted.stream().filter(p -> called.calls().stream().anyMatch(p::overlaps)).count();
        assertThat(Integer.parseInt(cols[2])).isEqualTo(counted.size());
        assertThat(Integer.parseInt(cols[3])).isEqualTo(called.calls().size());
        assertThat(cols[4]).isEqualTo(String.format(Locale.ROOT, "%.3f", (double) found / counted.size()));
        long totalLength = planted.regions().values().stream().mapToLong(Integer::longValue).sum();
        assertThat(Long.parseLong(cols[1])).isEqualTo(totalLength);
        assertThat(r.out().replaceAll("\\s+", " ")).contains("not for clinical or diagnostic decisions");
    }
}
