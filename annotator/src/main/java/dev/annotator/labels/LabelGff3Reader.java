package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.Consumer;

/**
 * Reads known features from GFF3 (Sequence Ontology GFF3 specification v1.26) for training: nine tab-separated
 * columns, 1-based closed coordinates, percent-encoded columns decoded. A feature whose type (column 3) is a
 * label's {@code feature_type} or {@code so_accession} gives its bases that label; features of other types are
 * skipped (and reported once as a warning). Comment and directive lines are skipped; {@code ##FASTA} ends the
 * features, as the specification says. Problems are one-line {@link BadInputException}s {@code FILE:LINE: what}.
 */
public final class LabelGff3Reader {
    private final HmmModel model;
    private final Map<String, Integer> labelByType = new HashMap<>();
    private final Map<String, Integer> forwardByType = new HashMap<>();
    private final Map<String, Integer> reverseByType = new HashMap<>();

    public LabelGff3Reader(HmmModel model) {
        this.model = model;
        List<Label> labels = model.labels();
        for (int i = 0; i < labels.size(); i++) {
            Label l = labels.get(i);
            Map<String, Integer> map = switch (l.strand()) {
                case '+' -> forwardByType;
                case '-' -> reverseByType;
                default -> labelByType;
            };
            if (l.featureType() != null) {
                map.putIfAbsent(l.featureType(), i);
            }
            if (l.soAccession() != null) {
                map.putIfAbsent(l.soAccession(), i);
            }
        }
    }

    /**
     * The label of a feature of this type and strand (GFF3 column 7), or null when the type is no label. Types of
     * labels with a strand (genes on one strand) need a strand of + or -.
     */
    private Integer labelOf(String type, String strand, String where) {
        Integer plain = labelByType.get(type);
        if (plain != null) {
            return plain;
        }
        if (!forwardByType.containsKey(type) && !reverseByType.containsKey(type)) {
            return null;
        }
        Integer stranded = switch (strand) {
            case "+" -> forwardByType.get(type);
            case "-" -> reverseByType.get(type);
            default -> throw new BadInputException(where + "feature of type " + type + " needs strand + or - (column 7"
                    + " is '" + strand + "'): model " + model.name() + " has a label for each strand");
        };
        return stranded;
    }

    /**
     * Reads a labels file (plain or gzipped).
     *
     * @param warnings receives one line naming the feature types that were skipped, if any
     * @throws BadInputException malformed lines, features of different labels that overlap
     */
    public KnownLabels read(String path, Consumer<String> warnings) {
        return readFeatures(path, warnings).known(model);
    }

    /**
     * Reads a labels file (plain or gzipped) into its labelled features, before the one-label-per-base check of
     * {@link KnownLabels} (so that overlapping genes can be screened first).
     */
    public LabelledFeatures readFeatures(String path, Consumer<String> warnings) {
        String name = InputOpener.displayName(path);
        try (InputStream in = InputOpener.open(path, InputStream.nullInputStream());
             BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8), 1 << 16)) {
            return readFeatures(reader, name, warnings);
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
    }

    KnownLabels read(BufferedReader reader, String name, Consumer<String> warnings) throws IOException {
        return readFeatures(reader, name, warnings).known(model);
    }

    LabelledFeatures readFeatures(BufferedReader reader, String name, Consumer<String> warnings) throws IOException {
        Map<String, List<LabelledInterval>> bySeqid = new TreeMap<>();
        Map<String, Long> skippedTypes = new TreeMap<>();
        String text;
        long line = 0;
        while ((text = reader.readLine()) != null) {
            line++;
            if (text.startsWith("##FASTA")) {
                break;
            }
            if (text.isBlank() || text.startsWith("#")) {
                continue;
            }
            String[] col = text.split("\t", -1);
            String where = name + ":" + line + ": ";
            if (col.length != 9) {
                throw new BadInputException(where + "expected 9 tab-separated columns, found " + col.length);
            }
            String seqid = PercentDecoding.decode(col[0], where + "column 1 (seqid)");
            if (seqid.isEmpty()) {
                throw new BadInputException(where + "empty seqid");
            }
            String type = PercentDecoding.decode(col[2], where + "column 3 (type)");
            long start = Gff3Columns.coordinate(col[3], where, "start");
            long end = Gff3Columns.coordinate(col[4], where, "end");
            if (end < start) {
                throw new BadInputException(where + "end " + end + " is before start " + start);
            }
            Integer label = labelOf(type, col[6], where);
            if (label == null) {
                skippedTypes.merge(type, 1L, Long::sum);
                continue;
            }
            bySeqid.computeIfAbsent(seqid, s -> new ArrayList<>())
                    .add(new LabelledInterval(seqid, start, end, label, line));
        }
        if (!skippedTypes.isEmpty()) {
            List<String> parts = new ArrayList<>();
            skippedTypes.forEach((t, n) -> parts.add(t + " (" + n + ")"));
            warnings.accept(name + ": skipped features of types that are no label of model " + model.name() + ": "
                    + String.join(", ", parts));
        }
        return new LabelledFeatures(name, bySeqid);
    }
}
