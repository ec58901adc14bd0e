package dev.annotator.gff;

import dev.annotator.decode.PosteriorTrack;

import java.io.IOException;
import java.io.Writer;

/**
 * A label's posterior as a bedGraph track, as the UCSC Genome Browser documents the format
 * (genome.ucsc.edu/goldenPath/help/bedgraph.html): a {@code track type=bedGraph} line, then
 * {@code chrom chromStart chromEnd dataValue} separated by tabs, 0-based with the end excluded. Values carry 3
 * decimals; neighbouring lines of one record never repeat a value.
 */
public final class BedGraphWriter {
    private final Writer out;

    public BedGraphWriter(Writer out) {
        this.out = out;
    }

    /** @param name and description go in double quotes, so they must not contain one */
    public void writeTrackLine(String name, String description) throws IOException {
        out.write("track type=bedGraph name=\"" + name.replace('"', '\'') + "\" description=\""
                + description.replace('"', '\'') + "\"\n");
    }

    public void write(String seqid, PosteriorTrack track) throws IOException {
        StringBuilder b = new StringBuilder(64);
        for (int i = 0; i < track.runs(); i++) {
            b.setLength(0);
            b.append(seqid).append('\t').append(track.start(i)).append('\t').append(track.end(i)).append('\t');
            int m = track.milli(i);
            b.append(m / 1000).append('.');
            int frac = m % 1000;
            b.append((char) ('0' + frac / 100)).append((char) ('0' + frac / 10 % 10)).append((char) ('0' + frac % 10));
            out.write(b.append('\n').toString());
        }
    }
}
