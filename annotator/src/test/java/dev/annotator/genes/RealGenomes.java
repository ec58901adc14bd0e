package dev.annotator.genes;

import dev.annotator.evaluate.FeatureSet;
import dev.annotator.evaluate.GenbankTruth;
import dev.annotator.seq.GenbankRecordReader;
import dev.annotator.seq.SequenceRecord;

import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * The published GenBank records in test-data/genbank (provenance and checksums in test-data/README.md, checked by
 * {@code GenbankTestDataTest}), read once per test class: sequence and simple CDS.
 */
final class RealGenomes {
    static final Path FOLDER = Path.of("..", "test-data", "genbank");

    record Genome(String path, String seqid, String sequence, FeatureSet truth) {
    }

    private RealGenomes() {
    }

    static Genome chlamydia() {
        return read("ct.gbk.gz");
    }

    static Genome chloroplast() {
        return read("NC_000932.gb.gz");
    }

    static Genome plasmid() {
        return read("NC_005816.gb.gz");
    }

    static Genome read(String file) {
        return read(file, false);
    }

    /** @param withParts whether the parts of CDS joins count as reference features (see GenbankTruth) */
    static Genome read(String file, boolean withParts) {
        String path = FOLDER.resolve(file).toString();
        if (!Files.isRegularFile(Path.of(path))) {
            throw new IllegalStateException(path + " is missing: the published records are part of the repository");
        }
        SequenceRecord r;
        try (GenbankRecordReader reader = GenbankRecordReader.open(path, InputStream.nullInputStream())) {
            r = reader.next();
        }
        FeatureSet truth = new GenbankTruth(InputStream.nullInputStream(), withParts).read(path, "CDS");
        return new Genome(path, r.name(), new String(r.bases(), StandardCharsets.US_ASCII), truth);
    }
}
