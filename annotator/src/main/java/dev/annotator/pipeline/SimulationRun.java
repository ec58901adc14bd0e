package dev.annotator.pipeline;

import dev.annotator.gff.FeatureIdAllocator;
import dev.annotator.gff.Gff3Writer;
import dev.annotator.gff.SegmentFeatures;
import dev.annotator.model.HmmModel;
import dev.annotator.seq.FastaWriter;
import dev.annotator.simulate.PlantedSegment;
import dev.annotator.simulate.SequenceSimulator;
import dev.annotator.simulate.SimulatedRecord;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Samples records from a model and writes them as FASTA, with their true segments as GFF3. Records are named
 * {@code PREFIX1, PREFIX2, ...}; one random stream seeded once drives all of them, so a seed fixes the output
 * byte for byte.
 */
public final class SimulationRun {
    private final HmmModel model;
    private final SequenceSimulator simulator;

    public SimulationRun(HmmModel model) {
        this.model = model;
        this.simulator = new SequenceSimulator(model);
    }

    /** Samples one record per name, of the matching length, from one random stream seeded with {@code seed}. */
    public List<SimulatedRecord> sample(List<String> names, int[] lengths, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<SimulatedRecord> out = new ArrayList<>();
        for (int i = 0; i < lengths.length; i++) {
            out.add(simulator.sample(names.get(i), lengths[i], rng));
        }
        return out;
    }

    /**
     * Samples records of equal length and writes them; keeps nothing in memory beyond one record.
     *
     * @param truth null for no truth file
     */
    public void write(String prefix, int length, int records, long seed, OutputStream fasta, Writer truth)
            throws IOException {
        FastaWriter fastaWriter = new FastaWriter(fasta);
        Gff3Writer truthWriter = truth == null ? null : new Gff3Writer(truth);
        if (truthWriter != null) {
            truthWriter.writeHeader();
        }
        SegmentFeatures features = new SegmentFeatures(model.labels());
        FeatureIdAllocator ids = new FeatureIdAllocator();
        SplittableRandom rng = new SplittableRandom(seed);
        for (int i = 0; i < records; i++) {
            SimulatedRecord r = simulator.sample(prefix + (i + 1), length, rng);
            fastaWriter.write(r.record());
            if (truthWriter != null) {
                writeTruth(truthWriter, features, ids, r);
            }
        }
        fastaWriter.flush();
        if (truthWriter != null) {
            truthWriter.flush();
        }
    }

    /** Writes one record's planted segments as GFF3 features (with its sequence-region line). */
    public static void writeTruth(Gff3Writer writer, SegmentFeatures features, FeatureIdAllocator ids,
                                  SimulatedRecord r) throws IOException {
        String seqid = r.record().name();
        writer.writeSequenceRegion(seqid, r.record().length());
        for (PlantedSegment p : r.planted()) {
            writer.writeFeature(features.truth(seqid, p.label(), p.start(), p.end(), ids));
        }
    }
}
