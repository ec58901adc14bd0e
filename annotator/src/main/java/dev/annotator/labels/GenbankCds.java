package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.io.InputOpener;
import dev.annotator.seq.FeatureLocation;
import dev.annotator.seq.GenbankEntry;
import dev.annotator.seq.GenbankRecordReader;

import java.io.InputStream;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The coding sequences (CDS features) of a GenBank file, sorted by what gene-structure training can use: simple
 * ones (one interval, {@code a..b} or {@code complement(a..b)}), multi-part ones (join/order: spliced, trans-spliced
 * or frameshifted), and counts of those left out: partial ({@code <} or {@code >}, the gene runs past the stated
 * bounds) and other (no interval of the record, see {@link InsdcLocation}). A location that is partial and
 * multi-part counts as partial; one that is unmodelled counts as other whatever else it is.
 *
 * @param recordLengths bases per record, by seqid in file order (seqids as {@link GenbankRecordReader} names them)
 * @param simple        single-interval CDS in file order
 * @param multiPart     each multi-part CDS as its intervals in reading order (5' to 3'), in file order
 * @param partial       CDS left out for a partial end
 * @param other         CDS left out for a part that is no interval of the record
 */
public record GenbankCds(Map<String, Integer> recordLengths, List<StrandedFeature> simple,
                         List<List<StrandedFeature>> multiPart, int partial, int other) {
    public GenbankCds {
        recordLengths = Collections.unmodifiableMap(new LinkedHashMap<>(recordLengths));
        simple = List.copyOf(simple);
        multiPart = multiPart.stream().map(List::copyOf).toList();
    }

    /**
     * Reads every record of a GenBank file (or stdin for "-"; plain or gzip).
     *
     * @throws BadInputException malformed GenBank data, including a CDS location that is not INSDC syntax or lies
     *                           outside its record: {@code FILE:LINE: record LOCUSNAME: CDS location 'TEXT': what}
     */
    public static GenbankCds read(String pathOrDash, InputStream stdin) {
        String fileName = InputOpener.displayName(pathOrDash);
        Map<String, Integer> lengths = new LinkedHashMap<>();
        List<StrandedFeature> simple = new ArrayList<>();
        List<List<StrandedFeature>> multi = new ArrayList<>();
        int partial = 0;
        int other = 0;
        try (GenbankRecordReader reader = GenbankRecordReader.open(pathOrDash, stdin)) {
            GenbankEntry entry;
            while ((entry = reader.nextEntry()) != null) {
                String seqid = entry.sequence().name();
                lengths.put(seqid, entry.sequence().length());
                for (FeatureLocation f : entry.featuresOf("CDS")) {
                    InsdcLocation loc = parse(fileName, entry, f);
                    if (loc.unmodelled()) {
                        other++;
                    } else if (loc.partial()) {
                        partial++;
                    } else if (loc.multiPart()) {
                        multi.add(loc.parts());
                    } else {
                        simple.add(loc.parts().get(0));
                    }
                }
            }
        }
        return new GenbankCds(lengths, simple, multi, partial, other);
    }

    private static InsdcLocation parse(String fileName, GenbankEntry entry, FeatureLocation f) {
        try {
            return InsdcLocation.parse(f.location(), entry.sequence().name(), entry.sequence().length());
        } catch (InsdcLocation.Malformed e) {
            String shown = f.location().length() > 60 ? f.location().substring(0, 60) + "..." : f.location();
            shown = shown.replaceAll("\\p{Cntrl}", "?"); // one line, no terminal escapes
            throw new BadInputException(fileName + ":" + f.line() + ": record " + entry.locusName()
                    + ": CDS location '" + shown + "': " + e.getMessage());
        }
    }

    /** Multi-part CDS kept. */
    public int joined() {
        return multiPart.size();
    }

    /** Every CDS feature of the file. */
    public int total() {
        return simple.size() + multiPart.size() + partial + other;
    }

    /** The simple CDS of one record, in file order. */
    public List<StrandedFeature> simpleOn(String seqid) {
        return simple.stream().filter(f -> f.seqid().equals(seqid)).toList();
    }
}
