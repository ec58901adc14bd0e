package dev.annotator.seq;

import org.biojava.nbio.core.sequence.DNASequence;
import org.biojava.nbio.core.sequence.io.FastaReaderHelper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Reads one generated file with our reader and with BioJava's stock DNA reader, which builds a compound
 * object per base and is independent of our creator, header handling and line scanner.
 */
class FastaCrossCheckTest {

    @TempDir
    Path dir;

    @Test
    void sameNamesAndSequencesAsBioJavasStockDnaReader() throws IOException {
        String fasta = FastaRecordReaderTest.randomFasta(new Random(2024), 25, 20_000, 61);
        Path f = Files.write(dir.resolve("generated.fa"), fasta.getBytes(StandardCharsets.US_ASCII));

        Map<String, String> ours = new LinkedHashMap<>();
        List<String> warnings = new ArrayList<>();
        try (FastaRecordReader r = FastaRecordReader.open(f.toString(), null, warnings::add)) {
            for (SequenceRecord rec; (rec = r.next()) != null; ) {
                // BioJava's GenericFastaHeaderParser uses the whole header as the key when it has no '|'
                ours.put(rec.name() + " " + rec.description(), FastaRecordReaderTest.text(rec));
            }
        }

        // Source: BioJava 7.2.2 FastaReaderHelper.readFastaDNASequence(File), with DNACompoundSet (A C G T N,
        // either case), the stock reader of the library (biojava-core).
        Map<String, DNASequence> reference = FastaReaderHelper.readFastaDNASequence(f.toFile());
        Map<String, String> theirs = new LinkedHashMap<>();
        reference.forEach((key, seq) -> theirs.put(key, seq.getSequenceAsString()));

        assertThat(ours).hasSize(25);
        assertThat(warnings).isEmpty();
        assertThat(ours.keySet()).containsExactlyElementsOf(theirs.keySet());
        assertThat(ours).isEqualTo(theirs);
    }
}
