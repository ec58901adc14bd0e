package dev.annotator.pipeline;

import dev.annotator.labels.KnownLabels;
import dev.annotator.seq.FastaRecordReader;
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
    private FastaRecordReader reader;
    private CountItem next;

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
            if (reader == null) {
                if (++file >= inputs.size()) {
                    return false;
                }
                reader = FastaRecordReader.open(inputs.get(file), InputStream.nullInputStream(), warnings);
            }
            SequenceRecord r = reader.next();
            if (r == null) {
                reader.close();
                reader = null;
            } else {
                String where = inputs.get(file) + ": record " + r.name();
                next = new CountItem(where, r.bases(), labels == null ? null : labels.labelsOf(r.name(), r.length()));
            }
        }
        return true;
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
