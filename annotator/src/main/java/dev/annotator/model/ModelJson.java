package dev.annotator.model;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;

import java.io.FilterInputStream;
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

    /**
     * The largest model file read, in bytes (64 MiB). The whole document is parsed into a tree before it is
     * checked, and the tree takes several times the file's size, so a model file (untrusted input) is refused
     * once it passes this size rather than when the heap runs out. An order-8 state with full-precision numbers
     * takes about 8 MiB, so the limit leaves room for several of the largest states the validator allows.
     */
    public static final long MAX_FILE_BYTES = 64L << 20;

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
            root = JsonTree.read(new SizeLimitedInput(in, displayName));
        } catch (JsonProcessingException e) {
            throw notJson(e, displayName);
        } catch (IOException e) {
            throw new IoFailureException(displayName + ": cannot read: " + e.getMessage(), e);
        }
        if (root == null) {
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

    static BadInputException tooLarge(String displayName) {
        return new BadInputException(displayName + ": larger than " + (MAX_FILE_BYTES >> 20)
                + " MiB, the most a model file may be");
    }

    /** Counts bytes on their way to the parser and stops it at {@link #MAX_FILE_BYTES}. */
    private static final class SizeLimitedInput extends FilterInputStream {
        private final String displayName;
        private long count;

        SizeLimitedInput(InputStream in, String displayName) {
            super(in);
            this.displayName = displayName;
        }

        @Override
        public int read() throws IOException {
            int b = in.read();
            if (b >= 0) {
                counted(1);
            }
            return b;
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            int n = in.read(b, off, len);
            if (n > 0) {
                counted(n);
            }
            return n;
        }

        @Override
        public long skip(long n) throws IOException {
            long skipped = in.skip(n);
            counted(skipped);
            return skipped;
        }

        private void counted(long n) {
            count += n;
            if (count > MAX_FILE_BYTES) {
                throw tooLarge(displayName);
            }
        }
    }

    /**
     * The parser's messages name its own settings ("enable `JsonReadFeature...` to allow", "bound as `JsonNode`");
     * a user cannot change those, so they are cut, leaving what is wrong with the file.
     */
    static String withoutParserSettings(String message) {
        return message.replaceAll(": enable `[^`]*` to allow", "")
                .replaceAll(" \\(bound as `[^`]*`\\)", "")
                .replaceAll(": not allowed as per `[^`]*`", "")
                .replaceAll(", from `[^`]*`", "");
    }

    private static BadInputException notJson(JsonProcessingException e, String displayName) {
        JsonLocation at = e.getLocation();
        String what = e.getOriginalMessage() == null ? e.getClass().getSimpleName()
                : withoutParserSettings(e.getOriginalMessage().replaceAll("\\s+", " ").trim());
        if (at != null && at.getLineNr() > 0) {
            return new BadInputException(displayName + ":" + at.getLineNr() + ": not valid JSON: " + what
                    + " (column " + at.getColumnNr() + ")", e);
        }
        return new BadInputException(displayName + ": not valid JSON: " + what, e);
    }
}
