package dev.annotator.gff;

import dev.annotator.decode.Composition;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.RecordProfile;
import dev.annotator.decode.Segment;
import dev.annotator.model.Label;

import java.io.IOException;
import java.io.Writer;
import java.util.List;

/**
 * One tab-separated row per record for screening batches in a spreadsheet or a pipeline: name, length, GC, CpG
 * observed/expected, N fraction (all over the whole record; GC and o/e over unambiguous bases), then per reported
 * label the number of segments, bases covered, longest segment, mean and lowest segment confidence (a segment's
 * confidence is its score, the mean posterior) and the record's log2 likelihood ratio of the label's states
 * against the others per base. A value that does not exist (o/e without C or G, confidence without segments) is
 * {@code NA}.
 */
public final class RecordSummaryWriter {
    private final Writer out;
    private final List<String> labels;

    /** @param reported the model's reported labels, in model order */
    public RecordSummaryWriter(Writer out, List<Label> reported) {
        this.out = out;
        this.labels = reported.stream().map(Label::name).toList();
    }

    public void writeHeader() throws IOException {
        StringBuilder b = new StringBuilder("seqid\tlength\tgc\tcpg_oe\tn_fraction");
        for (String l : labels) {
            for (String column : List.of("segments", "bases", "longest", "mean_confidence", "min_confidence",
                    "log_odds_bits_per_base")) {
                b.append('\t').append(l).append('_').append(column);
            }
        }
        out.write(b.append('\n').toString());
    }

    /** @param a an annotation carrying a profile with composition */
    public void write(RecordAnnotation a) throws IOException {
        RecordProfile p = a.profile();
        Composition c = p.composition();
        StringBuilder b = new StringBuilder(a.seqid()).append('\t').append(a.length());
        b.append('\t').append(number(c.gc(), 4)).append('\t').append(number(c.cpgObservedExpected(), 4));
        b.append('\t').append(number((double) p.ambiguousBases() / a.length(), 4));
        for (String l : labels) {
            LabelTotals t = LabelTotals.of(a.segments(), l);
            b.append('\t').append(t.count()).append('\t').append(t.bases()).append('\t').append(t.longest());
            b.append('\t').append(number(t.meanConfidence(), 3)).append('\t').append(number(t.minConfidence(), 3));
            b.append('\t').append(number(p.logOddsBitsPerBase().get(l), 4));
        }
        out.write(b.append('\n').toString());
    }

    private static String number(double v, int decimals) {
        return Double.isFinite(v) ? FixedDecimals.format(v, decimals) : "NA";
    }

    /**
     * One label's segments in one record.
     *
     * @param meanConfidence mean of the segments' scores; NaN without segments
     * @param minConfidence  lowest segment score; NaN without segments
     */
    public record LabelTotals(int count, long bases, int longest, double meanConfidence, double minConfidence) {
        public static LabelTotals of(List<Segment> segments, String label) {
            int count = 0;
            long bases = 0;
            int longest = 0;
            double sum = 0;
            double min = Double.NaN;
            for (Segment s : segments) {
                if (!s.label().equals(label)) {
                    continue;
                }
                count++;
                bases += s.length();
                longest = Math.max(longest, s.length());
                sum += s.meanPosterior();
                min = Double.isNaN(min) ? s.meanPosterior() : Math.min(min, s.meanPosterior());
            }
            return new LabelTotals(count, bases, longest, count == 0 ? Double.NaN : sum / count, min);
        }
    }
}
