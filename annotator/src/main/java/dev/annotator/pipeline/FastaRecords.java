package dev.annotator.pipeline;

import dev.annotator.labels.KnownLabels;
import dev.annotator.seq.SequenceFiles;
import dev.annotator.seq.SequenceReader;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.train.CountItem;

import java.io.InputStream;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import java.util.function.Consumer;

/**
 * The records of several FASTA files, one after another, as items to count; with known labels, each record
 * carries its bases' labels. Holds one open reader at a time; close it when done (also after a failure).
 */
final class FastaRecords implements Iterator<CountItem>, AutoCloseable {
    private final List<String> inputs;
    private final KnownLabels labels;
    private final Consumer<String> warnings;
    private int file = -1;
    private SequenceReader reader;
    private CountItem next;
    private final java.util.ArrayDeque<CountItem> pending = new java.util.ArrayDeque<>();

    /**
     * @param labels   null for no labels
     * @param warnings receives the readers' warnings (records without bases)
     */
    FastaRecords(List<String> inputs, KnownLabels labels, Consumer<String> warnings) {
        this.inputs = inputs;
        this.labels = labels;
        this.warnings = warnings;
    }

    @Override
    public boolean hasNext() {
        while (next == null) {
            if (!pending.isEmpty()) {
                next = pending.poll();
                break;
            }
            if (reader == null) {
                if (++file >= inputs.size()) {
                    return false;
                }
                reader = SequenceFiles.open(inputs.get(file), InputStream.nullInputStream(), warnings);
            }
            SequenceRecord r = reader.next();
            if (r == null) {
                reader.close();
                reader = null;
            } else {
                String where = inputs.get(file) + ": record " + r.name();
                if (labels == null) {
                    next = new CountItem(where, r.bases(), null);
                } else {
                    split(where, r);
                }
            }
        }
        return true;
    }

    /** A labelled record, cut around the spans its labels leave out of training. */
    private void split(String where, SequenceRecord r) {
        byte[] classes = labels.labelsOf(r.name(), r.length());
        List<int[]> pieces = labels.pieces(r.name(), r.length());
        if (pieces.size() == 1 && pieces.get(0)[0] == 0 && pieces.get(0)[1] == r.length()) {
            pending.add(new CountItem(where, r.bases(), classes));
            return;
        }
        for (int[] p : pieces) {
            pending.add(new CountItem(where + " (bases " + (p[0] + 1) + ".." + p[1] + ")",
                    java.util.Arrays.copyOfRange(r.bases(), p[0], p[1]), java.util.Arrays.copyOfRange(classes, p[0], p[1])));
        }
    }

    @Override
    public CountItem next() {
        if (!hasNext()) {
            throw new NoSuchElementException();
        }
        CountItem out = next;
        next = null;
        return out;
    }

    @Override
    public void close() {
        if (reader != null) {
            reader.close();
            reader = null;
        }
    }
}
