package dev.annotator.hmm;

/**
 * The allowed successors of each state (transitions of probability above zero), grouped by how many a state has,
 * for {@link PosteriorMaxSumPass}. A gene topology is mostly chains: upstream positions, start and stop codon
 * bases and the first two codon positions each have one successor, so the maximisation needs no comparison and
 * no back-pointer for them; two successors take one comparison; only the rest walk a list. Within every group the
 * successors keep ascending state order, which the tie rule needs. Immutable.
 */
final class SuccessorGroups {
    final int stateCount;
    /** States with exactly one successor, and that successor. */
    final int[] oneState;
    final int[] oneSucc;
    /** States with two successors: the lower and the higher one, and the state's back-pointer slot. */
    final int[] twoState;
    final int[] twoLow;
    final int[] twoHigh;
    final int[] twoSlot;
    /** States with three or more successors: theirs at {@code manySucc[manyOffset[q]..manyOffset[q + 1])}. */
    final int[] manyState;
    final int[] manyOffset;
    final int[] manySucc;
    final int[] manySlot;
    /** States with no successor (every outgoing transition has probability 0): they can only end a path. */
    final int[] noneState;
    /** Back-pointer bytes per base: one per state with two or more successors. */
    final int slots;
    /** Per state: its only successor, or -1. */
    final int[] onlySuccessor;
    /** Per state: its back-pointer slot, or -1 when it has fewer than two successors. */
    final int[] slotOf;

    /**
     * @param succOffset successors of state s at {@code succState[succOffset[s]..succOffset[s + 1])}, ascending
     */
    SuccessorGroups(int[] succOffset, int[] succState) {
        int k = succOffset.length - 1;
        this.stateCount = k;
        int ones = 0;
        int twos = 0;
        int manys = 0;
        int manyEdges = 0;
        int nones = 0;
        for (int s = 0; s < k; s++) {
            int fan = succOffset[s + 1] - succOffset[s];
            switch (fan) {
                case 0 -> nones++;
                case 1 -> ones++;
                case 2 -> twos++;
                default -> {
                    manys++;
                    manyEdges += fan;
                }
            }
        }
        oneState = new int[ones];
        oneSucc = new int[ones];
        twoState = new int[twos];
        twoLow = new int[twos];
        twoHigh = new int[twos];
        twoSlot = new int[twos];
        manyState = new int[manys];
        manyOffset = new int[manys + 1];
        manySucc = new int[manyEdges];
        manySlot = new int[manys];
        noneState = new int[nones];
        onlySuccessor = new int[k];
        slotOf = new int[k];
        int one = 0;
        int two = 0;
        int many = 0;
        int edge = 0;
        int none = 0;
        int slot = 0;
        for (int s = 0; s < k; s++) {
            int lo = succOffset[s];
            int fan = succOffset[s + 1] - lo;
            onlySuccessor[s] = fan == 1 ? succState[lo] : -1;
            slotOf[s] = fan >= 2 ? slot : -1;
            switch (fan) {
                case 0 -> noneState[none++] = s;
                case 1 -> {
                    oneState[one] = s;
                    oneSucc[one++] = succState[lo];
                }
                case 2 -> {
                    twoState[two] = s;
                    twoLow[two] = succState[lo];
                    twoHigh[two] = succState[lo + 1];
                    twoSlot[two++] = slot++;
                }
                default -> {
                    manyState[many] = s;
                    manySlot[many] = slot++;
                    for (int q = lo; q < lo + fan; q++) {
                        manySucc[edge++] = succState[q];
                    }
                    manyOffset[++many] = edge;
                }
            }
        }
        this.slots = slot;
    }
}
