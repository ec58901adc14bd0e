package dev.annotator.labels;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Location syntax against the examples of the INSDC Feature Table Definition (DDBJ/ENA/GenBank), section 3.4.2.2
 * "Location examples" (recalled from memory): 467, 340..565, &lt;345..500, &lt;1..888, 1..&gt;888, 102.110,
 * 123^124, join(12..78,134..202), complement(34..126), complement(join(2691..4571,4918..5163)),
 * join(complement(4918..5163),complement(2691..4571)), J00194.1:100..202.
 */
class InsdcLocationTest {
    private static final long LENGTH = 10_000;

    private static InsdcLocation parse(String text) {
        return InsdcLocation.parse(text, "s", LENGTH);
    }

    private static StrandedFeature f(long start, long end, char strand) {
        return new StrandedFeature("s", start, end, strand);
    }

    @Test
    void simpleIntervals() {
        assertThat(parse("340..565")).isEqualTo(new InsdcLocation(List.of(f(340, 565, '+')), false, false, false));
        assertThat(parse("complement(34..126)"))
                .isEqualTo(new InsdcLocation(List.of(f(34, 126, '-')), false, false, false));
    }

    @Test
    void partialEnds() {
        assertThat(parse("<345..500").partial()).isTrue();
        assertThat(parse("<1..888").partial()).isTrue();
        assertThat(parse("1..>888").partial()).isTrue();
        assertThat(parse("complement(<1..>888)").partial()).isTrue();
    }

    /** Both spellings of the same spliced minus-strand feature give the same parts, 5' to 3'. */
    @Test
    void joinsInReadingOrder() {
        List<StrandedFeature> expected = List.of(f(4918, 5163, '-'), f(2691, 4571, '-'));
        InsdcLocation a = parse("complement(join(2691..4571,4918..5163))");
        InsdcLocation b = parse("join(complement(4918..5163),complement(2691..4571))");
        assertThat(a.parts()).isEqualTo(expected);
        assertThat(b.parts()).isEqualTo(expected);
        assertThat(a.multiPart()).isTrue();
        assertThat(parse("join(12..78,134..202)").parts()).containsExactly(f(12, 78, '+'), f(134, 202, '+'));
        assertThat(parse("order(12..78,134..202)").multiPart()).isTrue();
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {"467", "102.110", "123^124", "(102.110)..200", "J00194.1:100..202",
            "join(1..10,J00194.1:100..202)"})
    void wellFormedButNoIntervalOfThisRecord(String text) {
        assertThat(parse(text).unmodelled()).isTrue();
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
            "'';character 1: expected a base number, found the end",
            "12..;character 5: expected a base number, found the end",
            "complement(1..5;character 16: expected ')', found the end",
            "join(1..5,,8..9);character 11: expected a base number, found ','",
            "1..5x;character 5: unexpected 'x'",
            "gene(1..5);character 1: expected a base number, found 'g'",
            "50..10;interval 50..10 ends before it starts",
            "0..10;interval 0..10 ends before it starts",
            "9990..10001;interval 9990..10001 runs past the end of the record (10000 bases)"})
    void malformed(String text, String message) {
        assertThatThrownBy(() -> parse(text)).isInstanceOf(InsdcLocation.Malformed.class).hasMessage(message);
    }
}
