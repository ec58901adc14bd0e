package dev.annotator.cli;

import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.gff.SequenceRegion;
import htsjdk.tribble.readers.LineIterator;
import htsjdk.tribble.readers.LineIteratorImpl;
import htsjdk.tribble.readers.SynchronousLineReader;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A GFF3 file read back by an independent parser, htsjdk's {@link Gff3Codec} (test scope), which rejects files
 * that break the GFF3 specification v1.26 in ways it checks (for example a repeated ##sequence-region, or
 * feature lines without nine columns).
 */
record GffCalls(Map<String, Integer> regions, List<Call> calls) {

    /** One feature line: coordinates are 1-based and closed, as the specification defines them. */
    record Call(String seqid, String type, int start, int end, double score, Map<String, List<String>> attributes) {
        int length() {
            return end - start + 1;
        }

        boolean overlaps(Call other) {
            return seqid.equals(other.seqid) && start <= other.end && other.start <= end;
        }

        /** The feature without its ID, which is numbered through the file and so shifts when calls are dropped. */
        String withoutId() {
            Map<String, List<String>> rest = new LinkedHashMap<>(attributes);
            rest.remove("ID");
            return seqid + "\t" + type + "\t" + start + "\t" + end + "\t" + score + "\t" + rest;
        }
    }

    static GffCalls parse(byte[] gff3) {
        return parse(new String(gff3, StandardCharsets.UTF_8));
    }

    static GffCalls parse(String gff3) {
        Gff3Codec codec = new Gff3Codec();
        List<Call> calls = new ArrayList<>();
        LineIterator lines = new LineIteratorImpl(new SynchronousLineReader(new StringReader(gff3)));
        try {
            while (!codec.isDone(lines)) {
                htsjdk.tribble.gff.Gff3Feature f = codec.decode(lines);
                if (f != null) {
                    calls.add(new Call(f.getContig(), f.getType(), f.getStart(), f.getEnd(), f.getScore(),
                            f.getAttributes()));
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        Map<String, Integer> regions = new LinkedHashMap<>();
        for (SequenceRegion r : codec.getSequenceRegions()) {
            regions.put(r.getContig(), r.getEnd());
        }
        return new GffCalls(regions, calls);
    }

    List<Call> on(String seqid) {
        return calls.stream().filter(c -> c.seqid().equals(seqid)).toList();
    }
}
