package dev.annotator.gff;

import dev.annotator.decode.Composition;
import dev.annotator.decode.GeneDetails;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.Segment;
import dev.annotator.model.Label;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Turns decoded segments (and planted truth segments) into GFF3 features of the label's Sequence Ontology type.
 *
 * <p>Called segments carry: score = mean posterior of the label; attributes {@code ID}, {@code posterior_min}
 * (3 decimals), {@code log_odds} (bits, 2 decimals) and, for segments with a composition, {@code gc} and
 * {@code cpg_oe} (3 decimals). Attribute names start lowercase because the GFF3 specification reserves
 * uppercase-initial names (v1.26, Column 9). A number that is not finite (cpg_oe without C or G, log odds of a
 * base the other states cannot emit) is left out rather than written as text a reader cannot parse.
 *
 * <p>Segments of a label with a strand are genes: each becomes a {@code gene} and its {@code CDS} (see
 * {@link #called}).
 */
public final class SegmentFeatures {
    /** Column 2 of every feature this tool writes. */
    public static final String SOURCE = "annotator";

    private final Map<String, Label> labelsByName = new HashMap<>();

    /** @param labels the model's labels (all of them; background segments are rejected) */
    public SegmentFeatures(List<Label> labels) {
        for (Label l : labels) {
            labelsByName.putIfAbsent(l.name(), l);
        }
    }

    /** One feature per segment, in the annotation's order; IDs come from {@code ids}. */
    public List<Gff3Feature> called(RecordAnnotation annotation, FeatureIdAllocator ids) {
        List<Gff3Feature> out = new ArrayList<>(annotation.segments().size());
        for (Segment s : annotation.segments()) {
            Label label = reported(s.label());
            if (s.gene() != null) {
                gene(annotation.seqid(), s, label, ids, out);
                continue;
            }
            List<Map.Entry<String, List<String>>> attrs = new ArrayList<>(5);
            attrs.add(Map.entry("ID", List.of(ids.next(label.name()))));
            addNumber(attrs, "posterior_min", s.minPosterior(), 3);
            addNumber(attrs, "log_odds", s.logOddsBits(), 2);
            Composition c = s.composition();
            if (c != null) {
                addNumber(attrs, "gc", c.gc(), 3);
                addNumber(attrs, "cpg_oe", c.cpgObservedExpected(), 3);
            }
            out.add(new Gff3Feature(annotation.seqid(), SOURCE, label.featureType(), s.start(), s.end(),
                    s.meanPosterior(), '.', ".", attrs));
        }
        return out;
    }

    /**
     * A gene segment as a {@code gene} with one child of the label's type ({@code CDS}) joined by {@code Parent},
     * both spanning the start and the stop codon, on the gene's strand; the CDS carries the phase and the
     * attributes {@code start_codon} and {@code partial} ({@code 5'} and/or {@code 3'} for a gene that runs off the
     * end of its record).
     */
    private static void gene(String seqid, Segment s, Label label, FeatureIdAllocator ids, List<Gff3Feature> out) {
        GeneDetails g = s.gene();
        String geneId = ids.next("gene");
        List<String> partial = new ArrayList<>(2);
        if (g.partial5()) {
            partial.add("5'");
        }
        if (g.partial3()) {
            partial.add("3'");
        }
        List<Map.Entry<String, List<String>>> geneAttrs = new ArrayList<>(2);
        geneAttrs.add(Map.entry("ID", List.of(geneId)));
        if (!partial.isEmpty()) {
            geneAttrs.add(Map.entry("partial", partial));
        }
        out.add(new Gff3Feature(seqid, SOURCE, "gene", s.start(), s.end(), s.meanPosterior(), g.strand(), ".",
                geneAttrs));
        List<Map.Entry<String, List<String>>> attrs = new ArrayList<>(6);
        attrs.add(Map.entry("ID", List.of(ids.next(label.featureType().toLowerCase(java.util.Locale.ROOT)))));
        attrs.add(Map.entry("Parent", List.of(geneId)));
        addNumber(attrs, "posterior_min", s.minPosterior(), 3);
        addNumber(attrs, "log_odds", s.logOddsBits(), 2);
        if (g.startCodon() != null) {
            attrs.add(Map.entry("start_codon", List.of(g.startCodon())));
        }
        if (!partial.isEmpty()) {
            attrs.add(Map.entry("partial", partial));
        }
        out.add(new Gff3Feature(seqid, SOURCE, label.featureType(), s.start(), s.end(), s.meanPosterior(), g.strand(),
                Integer.toString(g.phase()), attrs));
    }

    /**
     * A planted (truth) segment of a simulated record: no score, only an {@code ID}; on its strand for a label
     * with one (a CDS then needs a phase: 0 as written, the simulated path's frame is not tracked here).
     */
    public Gff3Feature truth(String seqid, String labelName, long start, long end, FeatureIdAllocator ids) {
        Label label = reported(labelName);
        return new Gff3Feature(seqid, SOURCE, label.featureType(), start, end, null, label.strand(),
                label.stranded() ? "0" : ".", List.of(Map.entry("ID", List.of(ids.next(label.name())))));
    }

    private Label reported(String name) {
        Label label = labelsByName.get(name);
        if (label == null) {
            throw new IllegalArgumentException("segment label " + name + " is not a label of the model");
        }
        if (label.background()) {
            throw new IllegalArgumentException("segment label " + name + " is the background, which is never reported");
        }
        return label;
    }

    private static void addNumber(List<Map.Entry<String, List<String>>> attrs, String tag, double value,
                                  int decimals) {
        if (Double.isFinite(value)) {
            attrs.add(Map.entry(tag, List.of(FixedDecimals.format(value, decimals))));
        }
    }
}
