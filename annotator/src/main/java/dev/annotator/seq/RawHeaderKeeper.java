package dev.annotator.seq;

import org.biojava.nbio.core.sequence.AccessionID;
import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.io.template.SequenceHeaderParserInterface;

/**
 * Keeps BioJava's header text untouched. Names and descriptions come from {@link FastaLineScanner}, which
 * reads header bytes as UTF-8 whatever the platform charset; this text only serves to check that the
 * parser and the scanner agree on which record is which.
 */
final class RawHeaderKeeper implements SequenceHeaderParserInterface<ByteBackedSequence, NucleotideCompound> {

    @Override
    public void parseHeader(String header, ByteBackedSequence sequence) {
        sequence.setOriginalHeader(header);
        // the parser files each record under its accession; any non-null id will do
        sequence.setAccession(new AccessionID(header));
    }
}
