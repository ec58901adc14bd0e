package dev.annotator.evaluate;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;
import dev.annotator.labels.Gff3Columns;
import dev.annotator.labels.PercentDecoding;
import dev.annotator.labels.StrandedFeature;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads the features of one type from GFF3 (Sequence Ontology GFF3 specification v1.26), with their strands, and
 * the record lengths of its {@code ##sequence-region} directives.
 *
 * <p>Every feature line must have nine tab-separated columns and valid coordinates; only lines whose type
 * (column 3, percent-decoded) equals the requested type are kept, and those must have strand + or - (an
 * unstranded or unknown strand cannot be compared strand by strand). Seqids are percent-decoded. Several lines
 * that share an ID are the parts of one discontinuous feature (as the specification has it for a spliced CDS);
 * each part is kept as its own feature. {@code ##FASTA} ends the features. A {@code ##sequence-region} that starts
 * after 1 still counts the record from base 1 to its end. Problems are one-line {@link BadInputException}s,
 * {@code FILE:LINE: what}.
 */
public final class StrandedGff3Reader implements TruthSource {
    private static final String REGION = "##sequence-region";

    private final InputStream stdin;

    /** @param stdin what "-" reads */
    public StrandedGff3Reader(InputStream stdin) {
        this.stdin = stdin;
    }

    @Override
    public FeatureSet read(String pathOrDash, String featureType) {
        String name = InputOpener.displayName(pathOrDash);
        try (InputStream in = InputOpener.open(pathOrDash, stdin);
             BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8), 1 << 16)) {
            return read(reader, name, featureType);
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
    }

    /** Reads already opened text; {@code name} is used in messages. */
    public static FeatureSet read(BufferedReader reader, String name, String featureType) throws IOException {
        List<StrandedFeature> features = new ArrayList<>();
        Map<String, Long> lengths = new LinkedHashMap<>();
        String text;
        long line = 0;
        while ((text = reader.readLine()) != null) {
            line++;
            String where = name + ":" + line + ": ";
            if (text.startsWith("##FASTA")) {
                break;
            }
            if (text.startsWith(REGION) && (text.length() == REGION.length()
                    || Character.isWhitespace(text.charAt(REGION.length())))) {
                region(text, where, lengths);
                continue;
            }
            if (text.isBlank() || text.startsWith("#")) {
                continue;
            }
            String[] col = text.split("\t", -1);
            if (col.length != 9) {
                throw new BadInputException(where + "expected 9 tab-separated columns, found " + col.length);
            }
            String seqid = PercentDecoding.decode(col[0], where + "column 1 (seqid)");
            if (seqid.isEmpty()) {
                throw new BadInputException(where + "empty seqid");
            }
            long start = Gff3Columns.coordinate(col[3], where, "start");
            long end = Gff3Columns.coordinate(col[4], where, "end");
            if (end < start) {
                throw new BadInputException(where + "end " + end + " is before start " + start);
            }
            String type = PercentDecoding.decode(col[2], where + "column 3 (type)");
            if (!type.equals(featureType)) {
                continue;
            }
            features.add(new StrandedFeature(seqid, start, end, strand(col[6], where, featureType)));
        }
        return new FeatureSet(name, features, lengths);
    }

    private static char strand(String s, String where, String type) {
        if (s.equals("+") || s.equals("-")) {
            return s.charAt(0);
        }
        if (s.equals(".") || s.equals("?")) {
            throw new BadInputException(where + type + " feature has strand '" + s
                    + "'; comparing needs + or - on every " + type);
        }
        throw new BadInputException(where + "strand '" + s + "' is not one of + - . ?");
    }

    /** {@code ##sequence-region seqid start end}: the record runs to {@code end}. */
    private static void region(String text, String where, Map<String, Long> lengths) {
        String[] f = text.strip().split("\\s+");
        if (f.length != 4) {
            throw new BadInputException(where + REGION + " needs a seqid, a start and an end");
        }
        String seqid = PercentDecoding.decode(f[1], where + REGION + " seqid");
        long start = Gff3Columns.coordinate(f[2], where, REGION + " start");
        long end = Gff3Columns.coordinate(f[3], where, REGION + " end");
        if (end < start) {
            throw new BadInputException(where + REGION + " end " + end + " is before start " + start);
        }
        Long before = lengths.putIfAbsent(seqid, end);
        if (before != null && before != end) {
            throw new BadInputException(where + REGION + " gives record " + seqid + " a second, different end "
                    + end + " (was " + before + ")");
        }
    }
}
