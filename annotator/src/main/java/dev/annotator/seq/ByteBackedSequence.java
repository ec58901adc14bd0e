package dev.annotator.seq;

import org.biojava.nbio.core.sequence.AccessionID;
import org.biojava.nbio.core.sequence.compound.AmbiguityDNACompoundSet;
import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.template.AbstractSequence;
import org.biojava.nbio.core.sequence.template.CompoundSet;
import org.biojava.nbio.core.sequence.template.ProxySequenceReader;
import org.biojava.nbio.core.sequence.template.SequenceMixin;
import org.biojava.nbio.core.sequence.template.SequenceView;

import java.nio.charset.StandardCharsets;
import java.util.Iterator;
import java.util.List;

/**
 * A BioJava sequence whose storage is one byte per base. BioJava's own DNA sequences keep a list of compound
 * objects (several bytes per base); this keeps FASTA parsing at the size of the data.
 */
final class ByteBackedSequence extends AbstractSequence<NucleotideCompound> {
    private final byte[] bases;

    ByteBackedSequence(byte[] bases) {
        super(new Storage(bases), AmbiguityDNACompoundSet.getDNACompoundSet());
        this.bases = bases;
    }

    /** The bases exactly as parsed; not copied. */
    byte[] bases() {
        return bases;
    }

    /** Read-only storage over the byte array, answering BioJava's sequence questions from it. */
    private static final class Storage implements ProxySequenceReader<NucleotideCompound> {
        private final byte[] bases;
        private final CompoundSet<NucleotideCompound> compounds = AmbiguityDNACompoundSet.getDNACompoundSet();

        Storage(byte[] bases) {
            this.bases = bases;
        }

        @Override
        public int getLength() {
            return bases.length;
        }

        /** 1-based, as everywhere in BioJava. */
        @Override
        public NucleotideCompound getCompoundAt(int position) {
            return compounds.getCompoundForString(String.valueOf((char) (bases[position - 1] & 0xFF)));
        }

        @Override
        public int getIndexOf(NucleotideCompound compound) {
            return SequenceMixin.indexOf(this, compound);
        }

        @Override
        public int getLastIndexOf(NucleotideCompound compound) {
            return SequenceMixin.lastIndexOf(this, compound);
        }

        @Override
        public String getSequenceAsString() {
            return new String(bases, StandardCharsets.ISO_8859_1);
        }

        @Override
        public List<NucleotideCompound> getAsList() {
            return SequenceMixin.toList(this);
        }

        @Override
        public SequenceView<NucleotideCompound> getSubSequence(Integer start, Integer end) {
            return SequenceMixin.createSubSequence(this, start, end);
        }

        @Override
        public CompoundSet<NucleotideCompound> getCompoundSet() {
            return compounds;
        }

        @Override
        @SafeVarargs
        public final int countCompounds(NucleotideCompound... wanted) {
            return SequenceMixin.countCompounds(this, wanted);
        }

        @Override
        public SequenceView<NucleotideCompound> getInverse() {
            return SequenceMixin.inverse(this);
        }

        @Override
        public Iterator<NucleotideCompound> iterator() {
            return SequenceMixin.createIterator(this);
        }

        @Override
        public AccessionID getAccession() {
            return null; // the owning sequence carries the accession
        }

        @Override
        public void setCompoundSet(CompoundSet<NucleotideCompound> compoundSet) {
            throw new UnsupportedOperationException("the compound set of parsed FASTA bases is fixed");
        }

        @Override
        public void setContents(String sequence) {
            throw new UnsupportedOperationException("parsed FASTA bases are read-only");
        }
    }
}
