package dev.annotator.model;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * The tree read straight from the streaming parser against databind's own {@code readTree} (an
 * {@code ObjectReader} set up as the model reader was before: duplicate keys and trailing tokens refused): equal
 * trees with the same node classes, and the same failures with the same message and line.
 */
class JsonTreeTest {
    private static final ObjectReader DATABIND = new ObjectMapper(JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build())
            .reader().with(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);

    @Test
    void shippedModelsGiveDatabindsTree() throws IOException {
        for (String name : new String[]{"cpg-island", "bacterial-genes"}) {
            byte[] doc;
            try (InputStream in = JsonTreeTest.class.getResourceAsStream("/dev/annotator/models/" + name + ".json")) {
                assertThat(in).as(name).isNotNull();
                doc = in.readAllBytes();
            }
            sameTree(doc);
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {
            "{}", "[]", "0", "-7", "2147483647", "2147483648", "-9223372036854775808", "9223372036854775808",
            "123456789012345678901234567890", "0.5", "-1.25e-300", "1e400", "1E2", "\"text \\u00e9 \\n\"", "true",
            "false", "null", " {\"a\": [1, 2.0, [], {}, null], \"b\": {\"c\": \"d\"}} ",
            "{\"p\": [0.1, 0.2, 0.30000000000000004, 4.9e-324]}"})
    void valuesGiveDatabindsTree(String doc) throws IOException {
        sameTree(doc.getBytes(StandardCharsets.UTF_8));
    }

    @ParameterizedTest
    @ValueSource(strings = {
            "{\"a\": 1, \"a\": 2}", "{\"a\": 1}\n{}", "[1] 2", "{\"a\": }", "{\"a\": 1,}", "[1, 2", "{'a': 1}",
            "{\"a\": NaN}", "\"unterminated", "{\"a\": 01}", "tru"})
    void failuresMatchDatabind(String doc) {
        byte[] bytes = doc.getBytes(StandardCharsets.UTF_8);
        JsonProcessingException expected = null;
        try {
            DATABIND.readTree(new ByteArrayInputStream(bytes));
        } catch (JsonProcessingException e) {
            expected = e;
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        assertThat(expected).as("databind refuses %s", doc).isNotNull();
        JsonProcessingException want = expected;
        assertThatThrownBy(() -> JsonTree.read(new ByteArrayInputStream(bytes)))
                .isInstanceOf(JsonProcessingException.class)
                .satisfies(e -> {
                    JsonProcessingException got = (JsonProcessingException) e;
                    assertThat(ModelJson.withoutParserSettings(got.getOriginalMessage()))
                            .isEqualTo(ModelJson.withoutParserSettings(want.getOriginalMessage()));
                    assertThat(got.getLocation().getLineNr()).isEqualTo(want.getLocation().getLineNr());
                });
    }

    @Test
    void noValueAtAllIsNull() throws IOException {
        assertThat(JsonTree.read(new ByteArrayInputStream(" \n\t".getBytes(StandardCharsets.UTF_8)))).isNull();
        JsonNode databind = DATABIND.readTree(new ByteArrayInputStream(" \n\t".getBytes(StandardCharsets.UTF_8)));
        assertThat(databind == null || databind.isMissingNode()).isTrue();
    }

    private static void sameTree(byte[] doc) throws IOException {
        JsonNode want = DATABIND.readTree(new ByteArrayInputStream(doc));
        JsonNode got = JsonTree.read(new ByteArrayInputStream(doc));
        assertThat(got).isEqualTo(want);
        sameClasses(got, want);
    }

    private static void sameClasses(JsonNode got, JsonNode want) {
        assertThat(got.getClass()).isEqualTo(want.getClass());
        for (int i = 0; i < want.size(); i++) {
            if (want.isArray()) {
                sameClasses(got.get(i), want.get(i));
            }
        }
        want.fieldNames().forEachRemaining(f -> sameClasses(got.get(f), want.get(f)));
    }
}
