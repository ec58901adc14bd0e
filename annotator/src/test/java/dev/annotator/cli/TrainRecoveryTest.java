package dev.annotator.cli;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.ShippedModels;
import dev.annotator.model.Transition;
import dev.annotator.train.Freeze;
import dev.annotator.train.Perturbation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Parameter recovery, driven through the command line: sequence simulated with {@code simulate} from a known
 * model is given to {@code train}, and the trained numbers must come back close to the known ones. The known
 * model is the shipped cpg-island model (islands of about 1 kb every 20 kb, first-order emissions), so the
 * thresholds are met with data of a realistic shape. The tolerances (0.02 for Baum-Welch from a perturbed start,
 * 0.01 for counting along the true labels) are those of the issue "Train models"; the sizes are chosen so the
 * sampling error of the scarcest emission row (island bases after a T, about 12% of some 95 kb of island sequence
 * per 2 Mbp) stays below them: counting on 6 Mbp has a standard error of about 0.002 there (measured errors
 * shrink as 1/sqrt(length): about 0.002 on 30 Mbp), Baum-Welch on 2 Mbp about 0.004.
 */
class TrainRecoveryTest {
    @TempDir
    Path tmp;

    @Test
    void baumWelchRecoversEveryProbabilityFromAPerturbedStart() throws IOException {
        HmmModel truth = ShippedModels.load("cpg-island").orElseThrow();
        Path fasta = tmp.resolve("sim.fa");
        run("simulate", "-m", "cpg-island", "--length", "1000000", "--records", "2", "--seed", "42", "-o",
                fasta.toString());
        // every probability moved by a factor of up to 4 (and rows renormalised)
        HmmModel perturbed = Perturbation.perturb(truth, new SplittableRandom(2026), Freeze.NONE);
        assertThat(maxDifference(perturbed, truth)).isGreaterThan(0.1);
        Path start = tmp.resolve("start.json");
        try (OutputStream out = Files.newOutputStream(start)) {
            ModelJson.write(perturbed, out);
        }
        Path trained = tmp.resolve("trained.json");
        run("train", "-q", "-m", start.toString(), "--method", "baum-welch", "--threads", "2", "-o",
                trained.toString(), fasta.toString());
        HmmModel fitted = ModelLoader.load(trained.toString());
        assertThat(maxDifference(fitted, truth)).isLessThan(0.02);
        assertThat(fitted.provenance().training().converged()).isTrue();
    }

    @Test
    void countingRecoversTheShippedTablesFromSimulatedTruth() throws IOException {
        HmmModel truth = ShippedModels.load("cpg-island").orElseThrow();
        Path fasta = tmp.resolve("sim.fa");
        Path gff = tmp.resolve("sim.gff3");
        run("simulate", "-m", "cpg-island", "--length", "2000000", "--records", "3", "--seed", "43", "-o",
                fasta.toString(), "--truth", gff.toString());
        Path trained = tmp.resolve("counted.json");
        run("train", "-q", "-m", "cpg-island", "--method", "counting", "--labels", gff.toString(), "-o",
                trained.toString(), fasta.toString());
        HmmModel counted = ModelLoader.load(trained.toString());
        assertThat(maxDifference(counted, truth)).isLessThan(0.01);

        // the model records how it was made, and model check prints it
        CliRun.Result check = CliRun.run("model", "check", trained.toString());
        assertThat(check.status()).isZero();
        assertThat(check.out()).contains("trained: counting by annotator ", "  input: " + fasta + ", "
                + Files.size(fasta) + " bytes, sha256 ", "  labels: " + gff + ", ", "  bases: 6000000\n",
                "  iterations: 1\n", "  log-likelihood of this model: ");
    }

    /** Largest absolute difference over every transition and emission probability. */
    static double maxDifference(HmmModel a, HmmModel b) {
        double max = 0;
        for (int i = 0; i < a.transitions().size(); i++) {
            Transition ta = a.transitions().get(i);
            Transition tb = b.transitions().get(i);
            assertThat(ta.from() + ta.to()).isEqualTo(tb.from() + tb.to());
            max = Math.max(max, Math.abs(ta.probability() - tb.probability()));
        }
        for (int s = 0; s < a.stateCount(); s++) {
            double[] ea = a.states().get(s).emissions();
            double[] eb = b.states().get(s).emissions();
            for (int i = 0; i < ea.length; i++) {
                max = Math.max(max, Math.abs(ea[i] - eb[i]));
            }
        }
        return max;
    }

    private static void run(String... args) {
        CliRun.Result r = CliRun.run(args);
        assertThat(r.status()).as(r.stderr()).isZero();
    }
}
