package dev.annotator.hmm;

/** The model gives the sequence probability zero: no state path can emit it. */
public final class ImpossibleSequenceException extends RuntimeException {
    private final int position;

    public ImpossibleSequenceException(int position) {
        super("no state path of the model can emit the sequence up to position " + (position + 1));
        this.position = position;
    }

    /** 0-based position where every path's probability became zero. */
    public int position() {
        return position;
    }
}
