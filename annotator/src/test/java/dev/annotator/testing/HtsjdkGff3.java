package dev.annotator.testing;

import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.gff.Gff3Feature;
import htsjdk.tribble.readers.LineIterator;
import htsjdk.tribble.readers.LineIteratorImpl;
import htsjdk.tribble.readers.SynchronousLineReader;

import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;

/** GFF3 text read back by an independent parser, htsjdk's {@link Gff3Codec} (4.1.3, test scope). */
public final class HtsjdkGff3 {
    private HtsjdkGff3() {
    }

    /** Every feature htsjdk decodes from the text, with a fresh codec of its default depth. */
    public static List<Gff3Feature> decodeAll(String text) throws IOException {
        return decodeAll(new Gff3Codec(), text);
    }

    /** Every feature the given codec decodes from the text; the codec keeps what it saw (such as regions). */
    public static List<Gff3Feature> decodeAll(Gff3Codec codec, String text) throws IOException {
        List<Gff3Feature> out = new ArrayList<>();
        LineIterator lines = new LineIteratorImpl(new SynchronousLineReader(new StringReader(text)));
        while (!codec.isDone(lines)) {
            Gff3Feature f = codec.decode(lines);
            if (f != null) {
                out.add(f);
            }
        }
        return out;
    }
}
