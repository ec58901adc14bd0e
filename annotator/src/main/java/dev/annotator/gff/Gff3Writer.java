package dev.annotator.gff;

import java.io.Closeable;
import java.io.Flushable;
import java.io.IOException;
import java.io.Writer;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes GFF3 as the Sequence Ontology's GFF3 specification v1.26 lays it out: the {@code ##gff-version 3}
 * directive first, at most one {@code ##sequence-region} per seqid, nine tab-separated columns per feature,
 * percent-encoding as {@link Gff3Escaping} describes, {@code '\n'} line ends.
 *
 * <p>Breaking one of the specification's rules (a second header, a second region for a seqid, a feature outside
 * its declared region, an unknown strand) is a programming error and throws {@link IllegalArgumentException} or
 * {@link IllegalStateException}; I/O failures surface as {@link IOException} for the caller to name the file.
 *
 * <p>The wrapped writer is closed by {@link #close()} only when the constructor was asked to; otherwise
 * {@code close()} just flushes, so standard output can be wrapped safely.
 */
public final class Gff3Writer implements Closeable, Flushable {
    private final Writer out;
    private final boolean closeUnderlying;
    private final StringBuilder line = new StringBuilder(256);
    private final Map<String, Long> regionLengths = new HashMap<>();
    private boolean anythingWritten;

    /** Wraps {@code out}; {@link #close()} will not close it. */
    public Gff3Writer(Writer out) {
        this(out, false);
    }

    /** Wraps {@code out}; {@link #close()} closes it when {@code closeUnderlying} is true. */
    public Gff3Writer(Writer out, boolean closeUnderlying) {
        this.out = out;
        this.closeUnderlying = closeUnderlying;
    }

    /** {@code ##gff-version 3}; the specification requires it to be the topmost line. */
    public void writeHeader() throws IOException {
        if (anythingWritten) {
            throw new IllegalStateException("##gff-version must be the first line");
        }
        emit("##gff-version 3");
    }

    /** {@code ##sequence-region seqid 1 length}; one per seqid, and later features must lie inside it. */
    public void writeSequenceRegion(String seqid, long length) throws IOException {
        requireSeqid(seqid);
        if (length < 1) {
            throw new IllegalArgumentException("sequence-region " + seqid + ": length must be at least 1, got "
                    + length);
        }
        if (regionLengths.putIfAbsent(seqid, length) != null) {
            throw new IllegalArgumentException("sequence-region " + seqid + " written twice");
        }
        line.setLength(0);
        line.append("##sequence-region ");
        Gff3Escaping.seqid(seqid, line);
        line.append(" 1 ").append(length);
        emit(line);
    }

    /** A human-readable comment line, {@code # text}; control characters are percent-encoded to keep it one line. */
    public void writeComment(String text) throws IOException {
        line.setLength(0);
        line.append("# ");
        Gff3Escaping.comment(text, line);
        emit(line);
    }

    public void writeFeature(Gff3Feature f) throws IOException {
        requireSeqid(f.seqid());
        if (f.start() < 1 || f.end() < f.start()) {
            throw new IllegalArgumentException("feature on " + f.seqid() + ": need 1 <= start <= end, got "
                    + f.start() + ".." + f.end());
        }
        Long regionLength = regionLengths.get(f.seqid());
        if (regionLength != null && f.end() > regionLength) {
            throw new IllegalArgumentException("feature " + f.seqid() + ":" + f.start() + ".." + f.end()
                    + " lies outside its sequence-region 1.." + regionLength);
        }
        line.setLength(0);
        Gff3Escaping.seqid(f.seqid(), line);
        line.append('\t');
        textColumn(f.source());
        line.append('\t');
        textColumn(f.type());
        line.append('\t').append(f.start()).append('\t').append(f.end()).append('\t');
        line.append(score(f.score())).append('\t');
        line.append(strand(f.strand())).append('\t');
        line.append(phase(f.phase())).append('\t');
        attributes(f.attributes());
        emit(line);
    }

    @Override
    public void flush() throws IOException {
        out.flush();
    }

    @Override
    public void close() throws IOException {
        if (closeUnderlying) {
            out.close();
        } else {
            out.flush();
        }
    }

    private void emit(CharSequence text) throws IOException {
        out.append(text).append('\n');
        anythingWritten = true;
    }

    private void textColumn(String s) {
        // an empty column would shift the reader's column count; the spec's "undefined" marker is "."
        if (s == null || s.isEmpty()) {
            line.append('.');
        } else {
            Gff3Escaping.column(s, line);
        }
    }

    private static String score(Double score) {
        if (score == null) {
            return ".";
        }
        if (!Double.isFinite(score)) {
            throw new IllegalArgumentException("score must be a finite number, got " + score);
        }
        return FixedDecimals.format(score, 3);
    }

    private static char strand(char strand) {
        if (strand != '+' && strand != '-' && strand != '.' && strand != '?') {
            throw new IllegalArgumentException("strand must be one of + - . ?, got '" + strand + "'");
        }
        return strand;
    }

    private static String phase(String phase) {
        if (phase == null) {
            return ".";
        }
        if (!phase.equals(".") && !phase.equals("0") && !phase.equals("1") && !phase.equals("2")) {
            throw new IllegalArgumentException("phase must be 0, 1, 2 or ., got '" + phase + "'");
        }
        return phase;
    }

    private void attributes(List<Map.Entry<String, List<String>>> attributes) {
        if (attributes.isEmpty()) {
            line.append('.');
            return;
        }
        boolean firstTag = true;
        for (Map.Entry<String, List<String>> a : attributes) {
            if (a.getKey().isEmpty()) {
                throw new IllegalArgumentException("attribute tag must not be empty");
            }
            if (a.getValue().isEmpty()) {
                throw new IllegalArgumentException("attribute " + a.getKey() + " has no value");
            }
            if (!firstTag) {
                line.append(';');
            }
            firstTag = false;
            Gff3Escaping.attribute(a.getKey(), line);
            line.append('=');
            boolean firstValue = true;
            for (String v : a.getValue()) {
                if (!firstValue) {
                    line.append(',');
                }
                firstValue = false;
                Gff3Escaping.attribute(v, line);
            }
        }
    }

    private static void requireSeqid(String seqid) {
        if (seqid == null || seqid.isEmpty()) {
            throw new IllegalArgumentException("seqid must not be empty");
        }
    }
}
