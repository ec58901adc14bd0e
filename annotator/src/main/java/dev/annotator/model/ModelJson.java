package dev.annotator.model;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectReader;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;

/**
 * Reads and writes model files in the {@value #FORMAT} JSON format. Reading is strict (duplicate keys,
 * unknown fields and trailing content are errors) and ends with {@link ModelValidator}, so a model that comes
 * back from {@link #read} is usable. Writing is deterministic: the same model always gives the same bytes, and
 * reading them back gives an equal model.
 */
public final class ModelJson {
    /** The format tag every model file starts with; a new incompatible layout gets a new tag. */
    public static final String FORMAT = "annotator-hmm/1";

    // ObjectReader is immutable, so one can be shared
    private static final ObjectReader READER = new ObjectMapper(JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build())
            .reader()
            .with(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);

    private ModelJson() {
    }

    /**
     * Reads and validates one model. The stream is read to its end but not closed.
     *
     * @param displayName how the input is named in error messages (usually the path as the user gave it)
     * @throws BadInputException   the content is not JSON, not a model, or not a valid model
     * @throws IoFailureException reading the stream failed
     */
    public static HmmModel read(InputStream in, String displayName) {
        JsonNode root;
        try {
            root = READER.readTree(in);
        } catch (JsonProcessingException e) {
            throw notJson(e, displayName);
        } catch (IOException e) {
            throw new IoFailureException(displayName + ": cannot read: " + e.getMessage(), e);
        }
        if (root == null || root.isMissingNode()) {
            throw new BadInputException(displayName + ": empty file, expected a JSON object");
        }
        HmmModel model = new ModelTreeReader(displayName).read(root);
        ModelValidator.validate(model, displayName);
        return model;
    }

    /** Writes the model as pretty-printed UTF-8 JSON ending in a newline; the stream is not closed. */
    public static void write(HmmModel model, OutputStream out) {
        try {
            out.write(toJson(model).getBytes(StandardCharsets.UTF_8));
            out.flush();
        } catch (IOException e) {
            throw new IoFailureException("writing model " + model.name() + " failed: " + e.getMessage(), e);
        }
    }

    /** The text {@link #write} produces. */
    public static String toJson(HmmModel model) {
        return JsonLayout.print(ModelTreeWriter.tree(model));
    }

    private static BadInputException notJson(JsonProcessingException e, String displayName) {
        JsonLocation at = e.getLocation();
        String what = e.getOriginalMessage() == null ? e.getClass().getSimpleName()
                : e.getOriginalMessage().replaceAll("\\s+", " ").trim();
        if (at != null && at.getLineNr() > 0) {
            return new BadInputException(displayName + ":" + at.getLineNr() + ": not valid JSON: " + what
                    + " (column " + at.getColumnNr() + ")", e);
        }
        return new BadInputException(displayName + ": not valid JSON: " + what, e);
    }
}
