package dev.annotator.conformance;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.IntPredicate;
import java.util.regex.Pattern;

/**
 * A strict reading of the Sequence Ontology's "Generic Feature Format Version 3 (GFF3)" specification, version
 * 1.26 (github.com/The-Sequence-Ontology/Specifications, gff3.md), written from the specification's text and
 * independent of the project's writer. Every rule names the section of the specification it comes from; where
 * the specification is ambiguous the choice is stated, and anything recalled from memory says so.
 *
 * <p>What is checked:
 * <ul>
 *   <li>the first line is exactly {@code ##gff-version 3}, {@code 3.x} or {@code 3.x.y}, and no second one
 *       follows (Other Syntax, "##gff-version");</li>
 *   <li>feature lines have exactly nine tab-separated, non-empty columns (Description of the Format);</li>
 *   <li>percent-escapes are well formed and decode as UTF-8; tab, newline, carriage return, '%' and control
 *       characters never appear literally; no character is encoded that need not be (Description of the
 *       Format);</li>
 *   <li>the seqid holds literally only {@code [a-zA-Z0-9.:^*$@!+_?-|]} (Column 1);</li>
 *   <li>the type is not undefined, and an accession has the form {@code SO:} plus seven digits (Column 3);</li>
 *   <li>start and end are positive integers with start &lt;= end (Columns 4 &amp; 5);</li>
 *   <li>the score is a floating point number or '.' (Column 6); the strand one of {@code + - . ?} (Column 7);
 *       the phase 0, 1 or 2, required for CDS, and '.' allowed otherwise (Column 8, NOTE 4);</li>
 *   <li>column 9 is {@code tag=value} pairs separated by ';', values separated by ',', with no literal
 *       ';' '=' '&amp;' ',' inside tags or values; tags that begin with an uppercase letter are only the
 *       reserved ones; only Parent, Alias, Note, Dbxref and Ontology_term take several values; a tag appears once
 *       per line; Target and Gap follow their stated formats (Column 9, The Gap Attribute);</li>
 *   <li>IDs are unique in the file and every Parent names an ID of the file, by the end of the file or by the
 *       next {@code ###} directive (Column 9 "ID", Parent Relationships, Other Syntax "###");</li>
 *   <li>{@code ##sequence-region seqid start end}: well formed, at most one per seqid, and all features of the
 *       seqid inside it, wherever the directive stands, except past the end of a landmark marked
 *       {@code Is_circular=true} (Other Syntax, Circular Genomes);</li>
 *   <li>after {@code ##FASTA} (or a line starting with '&gt;') only FASTA follows (Other Syntax, "##FASTA").</li>
 * </ul>
 *
 * <p>Stricter than the specification on purpose, because our writer never needs the looser forms: an ID may not
 * repeat even though the specification lets the lines of one discontinuous feature share it (Column 9, "ID");
 * lines end with LF only, so a carriage return is a literal control character (Description of the Format).
 * Not checked: that the type is a Sequence Ontology term (this needs the ontology), the Sequence Ontology's
 * part-of rules and cycles among Parents, and end-of-line comments (a '#' is legal inside values).
 */
public final class StrictGff3Reader {
    private static final Pattern VERSION_LINE = Pattern.compile("##gff-version 3(\\.[0-9]+(\\.[0-9]+)?)?");
    private static final Pattern POSITIVE_INTEGER = Pattern.compile("[1-9][0-9]*");
    private static final Pattern FLOAT = Pattern.compile("[+-]?([0-9]+(\\.[0-9]*)?|\\.[0-9]+)([eE][+-]?[0-9]+)?");
    private static final Pattern SO_ACCESSION = Pattern.compile("SO:[0-9]{7}");
    private static final Pattern GAP = Pattern.compile("[MIDFR][0-9]+( [MIDFR][0-9]+)*");
    private static final Pattern FASTA_SEQUENCE = Pattern.compile("[A-Za-z*-]*");

    /** Column 9: "These tags have predefined meanings" (the list of reserved tags in v1.26). */
    private static final Set<String> RESERVED_TAGS = Set.of("ID", "Name", "Alias", "Parent", "Target", "Gap",
            "Derives_from", "Note", "Dbxref", "Ontology_term", "Is_circular");
    /** Column 9: "In addition to Parent, the Alias, Note, Dbxref and Ontology_term attributes can have multiple values." */
    private static final Set<String> MULTI_VALUED = Set.of("Parent", "Alias", "Note", "Dbxref", "Ontology_term");

    /** Column 1: "must escape any characters not in the set [a-zA-Z0-9.:^*$@!+_?-|]". */
    private static final IntPredicate SEQID_PLAIN = StrictGff3Reader::seqidPlain;
    private static final IntPredicate SEQID_ESCAPABLE = SEQID_PLAIN.negate();
    /** Columns 2 and 3: everything but tab, newline, carriage return, '%' and control characters may be literal. */
    private static final IntPredicate TEXT_PLAIN = cp -> !PercentDecoder.isControl(cp) && cp != '%';
    /**
     * Columns 2 and 3 may encode what must be encoded everywhere, and also ';' '=' '&amp;' ','. The specification
     * says these "have reserved meanings in column 9 and must be escaped when used in other contexts", which can
     * be read as "elsewhere in column 9" or as "in other columns"; either reading is accepted here.
     */
    private static final IntPredicate TEXT_ESCAPABLE = cp -> PercentDecoder.isControl(cp) || ";=&,%".indexOf(cp) >= 0;
    /** Column 9 tags and values: ';' '=' '&amp;' ',' are separators and must be encoded inside tags and values. */
    private static final IntPredicate ATTRIBUTE_PLAIN = cp -> !PercentDecoder.isControl(cp) && "%;=&,".indexOf(cp) < 0;
    private static final IntPredicate ATTRIBUTE_ESCAPABLE = TEXT_ESCAPABLE;
    /** Column 9, "Target": "If the target_id contains spaces, they must be escaped as hex escape %20". */
    private static final IntPredicate TARGET_ID_ESCAPABLE = cp -> ATTRIBUTE_ESCAPABLE.test(cp) || cp == ' ';

    private final Map<String, ParsedGff3.Region> regions = new LinkedHashMap<>();
    private final List<ParsedFeature> features = new ArrayList<>();
    private final Map<String, Integer> idLines = new HashMap<>();
    private final List<Reference> pendingParents = new ArrayList<>();
    private final Set<String> circularSeqids = new HashSet<>();
    private String version;
    private boolean fastaSection;

    private record Reference(int line, String id) {
    }

    private StrictGff3Reader() {
    }

    /**
     * Reads a GFF3 file as UTF-8.
     *
     * @throws Gff3Violation naming the line of the first rule broken (bytes that are not UTF-8 included)
     */
    public static ParsedGff3 read(Path file) throws IOException {
        byte[] bytes = Files.readAllBytes(file);
        List<String> lines = new ArrayList<>();
        int from = 0;
        for (int i = 0; i <= bytes.length; i++) {
            if (i == bytes.length || bytes[i] == '\n') {
                if (i < bytes.length || from < bytes.length) {
                    lines.add(utf8Line(bytes, from, i, lines.size() + 1));
                }
                from = i + 1;
            }
        }
        return new StrictGff3Reader().parse(lines);
    }

    /**
     * Reads GFF3 text whose lines end with '\n' (the last one may lack it).
     *
     * @throws Gff3Violation naming the line of the first rule broken
     */
    public static ParsedGff3 read(String text) {
        List<String> lines = new ArrayList<>(Arrays.asList(text.split("\n", -1)));
        if (lines.size() > 1 && lines.get(lines.size() - 1).isEmpty()) {
            lines.remove(lines.size() - 1); // the terminator of the last line, not a line of its own
        }
        return new StrictGff3Reader().parse(lines);
    }

    private ParsedGff3 parse(List<String> lines) {
        if (lines.isEmpty()) {
            throw new Gff3Violation(1, "empty file: the ##gff-version directive must be present (Other Syntax)");
        }
        // Other Syntax, "##gff-version": "This directive must be present, must be the topmost line of the file",
        // its number "follows the format of 3.#.#" with the second and third numbers optional
        if (!VERSION_LINE.matcher(lines.get(0)).matches()) {
            throw new Gff3Violation(1, "the first line must be \"##gff-version 3\" (or 3.x, 3.x.y), found \""
                    + lines.get(0) + "\" (Other Syntax, ##gff-version)");
        }
        version = lines.get(0).substring("##gff-version ".length());
        for (int i = 1; i < lines.size(); i++) {
            int lineNo = i + 1;
            String line = lines.get(i);
            if (fastaSection) {
                fastaLine(line, lineNo);
            } else if (line.chars().allMatch(c -> c == ' ')) {
                // The Canonical Gene: "Blank lines should be ignored by parsers"
                continue;
            } else if (line.startsWith("##")) {
                noControlCharacters(line, lineNo, "directive");
                directive(line, lineNo);
            } else if (line.startsWith("#")) {
                noControlCharacters(line, lineNo, "comment");
            } else if (line.startsWith(">")) {
                // Other Syntax, ##FASTA: "a GFF line that begins with the character > creates an implied ##FASTA"
                fastaSection = true;
                fastaLine(line, lineNo);
            } else {
                feature(line, lineNo);
            }
        }
        resolveParents();
        checkRegions();
        return new ParsedGff3(version, Collections.unmodifiableMap(regions), List.copyOf(features));
    }

    private void directive(String line, int lineNo) {
        String name = line.split(" ", 2)[0];
        switch (name) {
            case "##gff-version" ->
                    // the directive "must be the topmost line of the file": a second one cannot be
                    throw new Gff3Violation(lineNo, "a second ##gff-version directive (Other Syntax, ##gff-version)");
            case "##sequence-region" -> sequenceRegion(line, lineNo);
            case "###" -> resolveParents();
            case "##FASTA" -> {
                if (!line.equals("##FASTA")) {
                    throw new Gff3Violation(lineNo, "##FASTA takes no arguments (Other Syntax, ##FASTA)");
                }
                fastaSection = true;
            }
            default -> {
                // Other Syntax: "Application specific directives are allowed"
            }
        }
    }

    /** Other Syntax, "##sequence-region seqid start end". */
    private void sequenceRegion(String line, int lineNo) {
        String[] parts = line.substring("##sequence-region".length()).trim().split(" +", -1);
        if (!line.startsWith("##sequence-region ") || parts.length != 3) {
            throw new Gff3Violation(lineNo, "##sequence-region needs exactly \"seqid start end\", found \"" + line
                    + "\" (Other Syntax, ##sequence-region)");
        }
        String seqid = PercentDecoder.decode(parts[0], lineNo, "##sequence-region seqid", SEQID_PLAIN,
                SEQID_ESCAPABLE);
        long start = positive(parts[1], lineNo, "##sequence-region start");
        long end = positive(parts[2], lineNo, "##sequence-region end");
        if (start > end) {
            // the region is a stretch of the landmark in the coordinates of Columns 4 & 5, where start <= end
            throw new Gff3Violation(lineNo, "##sequence-region start " + start + " is greater than end " + end
                    + " (Other Syntax, ##sequence-region; Columns 4 & 5)");
        }
        ParsedGff3.Region earlier = regions.putIfAbsent(seqid, new ParsedGff3.Region(lineNo, seqid, start, end));
        if (earlier != null) {
            throw new Gff3Violation(lineNo, "second ##sequence-region for seqid \"" + seqid + "\" (first on line "
                    + earlier.line() + "); \"only one ##sequence-region directive may be given for any given seqid\""
                    + " (Other Syntax)");
        }
    }

    private void feature(String line, int lineNo) {
        // Description of the Format: "GFF3 files are nine-column, tab-delimited, plain text files"
        String[] col = line.split("\t", -1);
        if (col.length != 9) {
            throw new Gff3Violation(lineNo, "expected 9 tab-separated columns, found " + col.length
                    + " (Description of the Format)");
        }
        for (int c = 0; c < 9; c++) {
            if (col[c].isEmpty()) {
                throw new Gff3Violation(lineNo, "column " + (c + 1) + " is empty; \"Undefined fields are replaced"
                        + " with the '.' character\" (Description of the Format)");
            }
        }
        String seqid = PercentDecoder.decode(col[0], lineNo, "column 1 (seqid)", SEQID_PLAIN, SEQID_ESCAPABLE);
        String source = PercentDecoder.decode(col[1], lineNo, "column 2 (source)", TEXT_PLAIN, TEXT_ESCAPABLE);
        String type = type(col[2], lineNo);
        long start = positive(col[3], lineNo, "column 4 (start)");
        long end = positive(col[4], lineNo, "column 5 (end)");
        if (start > end) {
            throw new Gff3Violation(lineNo, "start " + start + " is greater than end " + end
                    + "; \"Start is always less than or equal to end\" (Columns 4 & 5)");
        }
        Double score = score(col[5], lineNo);
        char strand = strand(col[6], lineNo);
        String phase = phase(col[7], type, lineNo);
        Map<String, List<String>> attributes = attributes(col[8], lineNo);

        if (attributes.containsKey("ID")) {
            String id = attributes.get("ID").get(0);
            Integer first = idLines.putIfAbsent(id, lineNo);
            if (first != null) {
                // Column 9, "ID": "IDs for each feature must be unique within the scope of the GFF file"
                throw new Gff3Violation(lineNo, "ID \"" + id + "\" already used on line " + first
                        + " (Column 9, ID)");
            }
        }
        for (String parent : attributes.getOrDefault("Parent", List.of())) {
            pendingParents.add(new Reference(lineNo, parent));
        }
        if (List.of("true").equals(attributes.get("Is_circular"))) {
            circularSeqids.add(seqid);
        }
        features.add(new ParsedFeature(lineNo, seqid, source, type, start, end, score, strand, phase, attributes));
    }

    /** Column 3: "either a term from the Sequence Ontology or an SO accession number". */
    private static String type(String raw, int lineNo) {
        String type = PercentDecoder.decode(raw, lineNo, "column 3 (type)", TEXT_PLAIN, TEXT_ESCAPABLE);
        if (type.equals(".")) {
            throw new Gff3Violation(lineNo, "column 3 (type) is undefined; the type is constrained to a Sequence"
                    + " Ontology term or accession (Column 3)");
        }
        // the text writes the form as "SO:000000", but its own example in the same sentence, sequence_feature
        // (SO:0000110), has seven digits, as Sequence Ontology accessions do
        if (type.startsWith("SO:") && !SO_ACCESSION.matcher(type).matches()) {
            throw new Gff3Violation(lineNo, "column 3 (type) \"" + type + "\" is not an accession of the form"
                    + " SO:0000000 (Column 3)");
        }
        return type;
    }

    /** Columns 4 &amp; 5: "positive 1-based integer coordinates". */
    private static long positive(String raw, int lineNo, String what) {
        if (!POSITIVE_INTEGER.matcher(raw).matches()) {
            throw new Gff3Violation(lineNo, what + " \"" + raw + "\" is not a positive integer (Columns 4 & 5)");
        }
        try {
            return Long.parseLong(raw);
        } catch (NumberFormatException e) {
            throw new Gff3Violation(lineNo, what + " \"" + raw + "\" is too large (Columns 4 & 5)");
        }
    }

    /** Column 6: "a floating point number"; Description of the Format: undefined is '.'. */
    private static Double score(String raw, int lineNo) {
        if (raw.equals(".")) {
            return null;
        }
        // a decimal literal, not Java's wider syntax (NaN, Infinity, hex floats, type suffixes)
        if (!FLOAT.matcher(raw).matches() || Double.isInfinite(Double.parseDouble(raw))) {
            throw new Gff3Violation(lineNo, "column 6 (score) \"" + raw + "\" is neither a floating point number"
                    + " nor '.' (Column 6)");
        }
        return Double.parseDouble(raw);
    }

    /** Column 7: '+', '-', '.' for unstranded, '?' for unknown. */
    private static char strand(String raw, int lineNo) {
        if (raw.length() != 1 || "+-.?".indexOf(raw.charAt(0)) < 0) {
            throw new Gff3Violation(lineNo, "column 7 (strand) \"" + raw + "\" is not one of + - . ? (Column 7)");
        }
        return raw.charAt(0);
    }

    /**
     * Column 8: "The phase is one of the integers 0, 1, or 2" and "is REQUIRED for all CDS features" (also NOTE 4);
     * other features may leave it undefined. The type may be written as the accession SO:0000316, which the
     * specification's NOTE 1 table gives for CDS.
     */
    private static String phase(String raw, String type, int lineNo) {
        boolean cds = type.equals("CDS") || type.equals("SO:0000316");
        if (raw.equals("0") || raw.equals("1") || raw.equals("2")) {
            return raw;
        }
        if (raw.equals(".") && !cds) {
            return raw;
        }
        throw new Gff3Violation(lineNo, "column 8 (phase) \"" + raw + "\" is not "
                + (cds ? "0, 1 or 2, which a CDS requires" : "0, 1, 2 or '.'") + " (Column 8)");
    }

    /** Column 9: "A list of feature attributes in the format tag=value", pairs separated by semicolons. */
    private static Map<String, List<String>> attributes(String raw, int lineNo) {
        Map<String, List<String>> out = new LinkedHashMap<>();
        if (raw.equals(".")) {
            return Collections.unmodifiableMap(out);
        }
        // the specification's own example under Circular Genomes ends its attributes with ';'
        String body = raw.endsWith(";") ? raw.substring(0, raw.length() - 1) : raw;
        for (String pair : body.split(";", -1)) {
            if (pair.isEmpty()) {
                throw new Gff3Violation(lineNo, "column 9 has an empty tag=value pair (Column 9)");
            }
            int eq = pair.indexOf('=');
            if (eq < 0) {
                throw new Gff3Violation(lineNo, "column 9 pair \"" + pair + "\" is not tag=value (Column 9)");
            }
            String tag = PercentDecoder.decode(pair.substring(0, eq), lineNo, "column 9 tag", ATTRIBUTE_PLAIN,
                    ATTRIBUTE_ESCAPABLE);
            if (tag.isEmpty()) {
                throw new Gff3Violation(lineNo, "column 9 pair \"" + pair + "\" has an empty tag (Column 9)");
            }
            if (Character.isUpperCase(tag.codePointAt(0)) && !RESERVED_TAGS.contains(tag)) {
                throw new Gff3Violation(lineNo, "tag \"" + tag + "\" begins with an uppercase letter but is not a"
                        + " predefined tag; \"All attributes that begin with an uppercase letter are reserved\""
                        + " (Column 9)");
            }
            if (out.containsKey(tag)) {
                // Column 9: "Multiple attributes of the same type are indicated by separating the values with the
                // comma"; a repeated tag is our strict reading of that sentence
                throw new Gff3Violation(lineNo, "tag \"" + tag + "\" appears twice; several values are separated"
                        + " by ',' (Column 9)");
            }
            String rawValue = pair.substring(eq + 1);
            List<String> values = new ArrayList<>();
            for (String v : rawValue.split(",", -1)) {
                if (v.isEmpty()) {
                    throw new Gff3Violation(lineNo, "tag \"" + tag + "\" has an empty value in \"" + rawValue
                            + "\" (Column 9)");
                }
                values.add(tag.equals("Target") ? target(v, lineNo)
                        : PercentDecoder.decode(v, lineNo, "value of " + tag, ATTRIBUTE_PLAIN, ATTRIBUTE_ESCAPABLE));
            }
            if (values.size() > 1 && RESERVED_TAGS.contains(tag) && !MULTI_VALUED.contains(tag)) {
                throw new Gff3Violation(lineNo, "tag \"" + tag + "\" has " + values.size() + " values; only Parent,"
                        + " Alias, Note, Dbxref and Ontology_term can have multiple values (Column 9)");
            }
            if (tag.equals("Gap") && !GAP.matcher(values.get(0)).matches()) {
                throw new Gff3Violation(lineNo, "Gap \"" + values.get(0) + "\" is not (operation,length) pairs"
                        + " separated by spaces, operations M I D F R (The Gap Attribute)");
            }
            out.put(tag, List.copyOf(values));
        }
        return Collections.unmodifiableMap(out);
    }

    /** Column 9, "Target": "target_id start end [strand]", where strand is optional and may be "+" or "-". */
    private static String target(String raw, int lineNo) {
        String[] parts = raw.split(" ", -1);
        if (parts.length != 3 && parts.length != 4) {
            throw new Gff3Violation(lineNo, "Target \"" + raw + "\" is not \"target_id start end [strand]\""
                    + " (Column 9, Target)");
        }
        String targetId = PercentDecoder.decode(parts[0], lineNo, "Target target_id", ATTRIBUTE_PLAIN,
                TARGET_ID_ESCAPABLE);
        long start = positive(parts[1], lineNo, "Target start");
        long end = positive(parts[2], lineNo, "Target end");
        if (start > end) {
            throw new Gff3Violation(lineNo, "Target start " + start + " is greater than end " + end
                    + " (Column 9, Target; Alignments: orientation goes in the strand, not the coordinates)");
        }
        if (parts.length == 4 && !parts[3].equals("+") && !parts[3].equals("-")) {
            throw new Gff3Violation(lineNo, "Target strand \"" + parts[3] + "\" is not + or - (Column 9, Target)");
        }
        return targetId + " " + start + " " + end + (parts.length == 4 ? " " + parts[3] : "");
    }

    /**
     * Parent Relationships: Parent names the ID of another feature. Other Syntax, "###": at that directive "all
     * forward references to feature IDs that have been seen to this point have been resolved"; at the end of the
     * file every reference must be.
     */
    private void resolveParents() {
        for (Reference r : pendingParents) {
            if (!idLines.containsKey(r.id())) {
                throw new Gff3Violation(r.line(), "Parent \"" + r.id() + "\" is not the ID of any feature before"
                        + " the next ### or the end of the file (Column 9, Parent; Other Syntax, ###)");
            }
        }
        pendingParents.clear();
    }

    /**
     * Other Syntax, "##sequence-region": "when one is given all features on that landmark feature (having that
     * seqid) must be contained within the range", except that features on a landmark marked Is_circular "may
     * extend their coordinates beyond the boundary" (Circular Genomes: the end then exceeds the length).
     */
    private void checkRegions() {
        for (ParsedFeature f : features) {
            ParsedGff3.Region r = regions.get(f.seqid());
            if (r == null) {
                continue;
            }
            boolean endInside = f.end() <= r.end() || circularSeqids.contains(f.seqid());
            if (f.start() < r.start() || !endInside) {
                throw new Gff3Violation(f.line(), "feature " + f.start() + ".." + f.end() + " on \"" + f.seqid()
                        + "\" lies outside its ##sequence-region " + r.start() + ".." + r.end() + " (line "
                        + r.line() + ") (Other Syntax, ##sequence-region)");
            }
        }
    }

    /** Other Syntax, "##FASTA": "Once a ##FASTA section is encountered no other content beyond valid FASTA". */
    private static void fastaLine(String line, int lineNo) {
        if (line.startsWith(">")) {
            if (line.length() == 1 || line.charAt(1) == ' ') {
                throw new Gff3Violation(lineNo, "FASTA header without a name after ##FASTA (Other Syntax, ##FASTA)");
            }
            return;
        }
        // sequence letters, '*' (stop) and '-' (gap): recalled from memory as the usual FASTA alphabet
        if (!FASTA_SEQUENCE.matcher(line).matches()) {
            throw new Gff3Violation(lineNo, "only FASTA may follow ##FASTA, found \"" + line + "\" (Other Syntax,"
                    + " ##FASTA)");
        }
    }

    /** Description of the Format: tab, newline, carriage return and control characters must be encoded. */
    private static void noControlCharacters(String line, int lineNo, String what) {
        for (int i = 0; i < line.length(); i++) {
            if (PercentDecoder.isControl(line.charAt(i))) {
                throw new Gff3Violation(lineNo, what + " holds the literal control character "
                        + PercentDecoder.show(line.charAt(i)) + " (Description of the Format)");
            }
        }
    }

    private static String utf8Line(byte[] bytes, int from, int to, int lineNo) {
        try {
            return StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes, from, to - from)).toString();
        } catch (CharacterCodingException e) {
            throw new Gff3Violation(lineNo, "the line is not valid UTF-8 (Description of the Format recommends"
                    + " Unicode; UTF-8 is our reading)");
        }
    }

    /**
     * The set is written [a-zA-Z0-9.:^*$@!+_?-|]. Read as a regular expression, "?-|" would be a range that also
     * admits '[', '\', ']', '`', '{'; the characters are taken literally here (a character class with a
     * range in the middle of a list of punctuation is unlikely to be meant), so those five must be escaped.
     */
    private static boolean seqidPlain(int cp) {
        return cp >= 'a' && cp <= 'z' || cp >= 'A' && cp <= 'Z' || cp >= '0' && cp <= '9'
                || cp < 128 && ".:^*$@!+_?-|".indexOf(cp) >= 0;
    }
}
