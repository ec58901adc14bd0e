package dev.annotator.labels;

import java.util.ArrayList;
import java.util.List;

/**
 * A feature location in the INSDC feature table syntax (the DDBJ/ENA/GenBank Feature Table Definition, section
 * 3.4), read into the intervals it covers in reading order (5' to 3'): {@code complement(join(a..b,c..d))}
 * is c..d then a..b on the minus strand.
 *
 * <p>Understood: {@code a..b}, {@code complement(...)}, {@code join(...)}, {@code order(...)}, and the partial
 * marks {@code <a} and {@code >b}. Well-formed forms that are no interval of this record are recognised and flagged
 * {@link #unmodelled()}: a single base {@code a}, a site between bases {@code a^b}, an uncertain base
 * {@code (a.b)} or {@code a.b}, and a reference into another entry {@code ACC.1:a..b}. Anything else is
 * {@link Malformed}.
 *
 * @param parts      the intervals in reading order; for unmodelled locations only the ones that are intervals
 * @param partial    a {@code <} or {@code >} mark: the feature continues beyond the stated bounds
 * @param multiPart  join or order of more than one part
 * @param unmodelled some part is no plain interval on this record (see above)
 */
record InsdcLocation(List<StrandedFeature> parts, boolean partial, boolean multiPart, boolean unmodelled) {
    InsdcLocation {
        parts = List.copyOf(parts);
    }

    /** A location that does not follow the syntax or lies outside its record; the message says what is wrong. */
    static final class Malformed extends RuntimeException {
        Malformed(String message) {
            super(message);
        }
    }

    /**
     * Reads {@code text} (without blanks) for a record of {@code recordLength} bases named {@code seqid}.
     *
     * @throws Malformed the text is not a location, or an interval ends before it starts or beyond the record
     */
    static InsdcLocation parse(String text, String seqid, long recordLength) {
        Parser p = new Parser(text, seqid, recordLength);
        Node node = p.location();
        if (p.pos != text.length()) {
            throw p.error("unexpected '" + text.charAt(p.pos) + "'");
        }
        return new InsdcLocation(node.parts, p.partial, node.parts.size() + node.others > 1 && p.multi, p.unmodelled);
    }

    /** Intervals found so far and how many parts were not intervals. */
    private record Node(List<StrandedFeature> parts, int others) {
    }

    /** Recursive descent over the location text, one character at a time. */
    private static final class Parser {
        private final String text;
        private final String seqid;
        private final long recordLength;
        private int pos;
        private boolean partial;
        private boolean multi;
        private boolean unmodelled;

        Parser(String text, String seqid, long recordLength) {
            this.text = text;
            this.seqid = seqid;
            this.recordLength = recordLength;
        }

        Node location() {
            if (text.startsWith("complement(", pos)) {
                pos += "complement(".length();
                Node inner = location();
                expect(')');
                List<StrandedFeature> flipped = new ArrayList<>();
                for (int i = inner.parts.size() - 1; i >= 0; i--) {
                    StrandedFeature f = inner.parts.get(i);
                    flipped.add(new StrandedFeature(f.seqid(), f.start(), f.end(), f.strand() == '+' ? '-' : '+'));
                }
                return new Node(flipped, inner.others);
            }
            if (text.startsWith("join(", pos) || text.startsWith("order(", pos)) {
                pos = text.indexOf('(', pos) + 1;
                multi = true;
                List<StrandedFeature> parts = new ArrayList<>();
                int others = 0;
                do {
                    Node part = location();
                    parts.addAll(part.parts);
                    others += part.others;
                } while (accept(','));
                expect(')');
                return new Node(parts, others);
            }
            if (remoteReferenceAhead()) {
                pos = text.indexOf(':', pos) + 1;
                unmodelled = true;
                span(false);
                return new Node(List.of(), 1);
            }
            return span(true);
        }

        /** {@code a..b}, or one of the single-position or uncertain forms (unmodelled). */
        private Node span(boolean onThisRecord) {
            boolean fuzzyStart = accept('<');
            long start = bound();
            if (accept('^') || (peek() == '.' && !text.startsWith("..", pos) && accept('.'))) {
                number(); // a^b: a site between two bases; a.b: one base between a and b
                unmodelled = true;
                return new Node(List.of(), 1);
            }
            if (!text.startsWith("..", pos)) {
                partial |= fuzzyStart;
                unmodelled = true; // a single base
                return new Node(List.of(), 1);
            }
            pos += 2;
            boolean fuzzyEnd = accept('>');
            long end = bound();
            partial |= fuzzyStart || fuzzyEnd;
            if (!onThisRecord || start < 0 || end < 0) {
                return new Node(List.of(), 1);
            }
            if (start < 1 || end < start) {
                throw new Malformed("interval " + start + ".." + end + " ends before it starts");
            }
            if (end > recordLength) {
                throw new Malformed("interval " + start + ".." + end + " runs past the end of the record ("
                        + recordLength + " bases)");
            }
            return new Node(List.of(new StrandedFeature(seqid, start, end, '+')), 0);
        }

        /** A base number, or -1 for an uncertain one, {@code (a.b)}: one base somewhere from a to b. */
        private long bound() {
            if (!accept('(')) {
                return number();
            }
            number();
            expect('.');
            number();
            expect(')');
            unmodelled = true;
            return -1;
        }

        /** An accession (letters, digits, '_', optional .version) followed by ':' starts here. */
        private boolean remoteReferenceAhead() {
            int i = pos;
            if (i >= text.length() || !Character.isLetter(text.charAt(i))) {
                return false;
            }
            while (i < text.length() && (Character.isLetterOrDigit(text.charAt(i)) || text.charAt(i) == '_'
                    || text.charAt(i) == '.')) {
                i++;
            }
            return i < text.length() && text.charAt(i) == ':';
        }

        private long number() {
            int from = pos;
            while (pos < text.length() && text.charAt(pos) >= '0' && text.charAt(pos) <= '9' && pos - from < 18) {
                pos++;
            }
            if (pos == from) {
                throw error(pos < text.length() ? "expected a base number, found '" + text.charAt(pos) + "'"
                        : "expected a base number, found the end");
            }
            return Long.parseLong(text, from, pos, 10);
        }

        private char peek() {
            return pos < text.length() ? text.charAt(pos) : '\0';
        }

        private boolean accept(char c) {
            if (peek() == c) {
                pos++;
                return true;
            }
            return false;
        }

        private void expect(char c) {
            if (!accept(c)) {
                throw error(pos < text.length() ? "expected '" + c + "', found '" + text.charAt(pos) + "'"
                        : "expected '" + c + "', found the end");
            }
        }

        Malformed error(String what) {
            return new Malformed("character " + (pos + 1) + ": " + what);
        }
    }
}
