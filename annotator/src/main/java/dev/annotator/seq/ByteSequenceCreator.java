package dev.annotator.seq;

import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.io.template.SequenceCreatorInterface;
import org.biojava.nbio.core.sequence.template.AbstractSequence;
import org.biojava.nbio.core.sequence.template.ProxySequenceReader;

import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * Hands BioJava's FASTA parser a sequence that stores one byte per base. The parser only ever calls the
 * String form; the other two forms belong to BioJava's lazy-loading and list-based readers, which this
 * project does not use.
 */
final class ByteSequenceCreator implements SequenceCreatorInterface<NucleotideCompound> {

    /**
     * The parser's String is Latin-1 compact (every byte was checked to be an ASCII base letter or blank),
     * so ISO-8859-1 encoding is a plain array copy.
     */
    @Override
    public AbstractSequence<NucleotideCompound> getSequence(String sequence, long index) {
        return new ByteBackedSequence(sequence.getBytes(StandardCharsets.ISO_8859_1));
    }

    @Override
    public AbstractSequence<NucleotideCompound> getSequence(ProxySequenceReader<NucleotideCompound> proxyLoader,
                                                            long index) {
        throw new UnsupportedOperationException("FASTA records are read eagerly, one at a time");
    }

    @Override
    public AbstractSequence<NucleotideCompound> getSequence(List<NucleotideCompound> list) {
        throw new UnsupportedOperationException("FASTA records are built from text, not compound lists");
    }
}
