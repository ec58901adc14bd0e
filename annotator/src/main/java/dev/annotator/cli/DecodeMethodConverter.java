package dev.annotator.cli;

import dev.annotator.decode.DecodeMethod;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

import java.util.Locale;

/** Reads --decode in the lowercase spelling the help shows. */
final class DecodeMethodConverter implements ITypeConverter<DecodeMethod> {
    @Override
    public DecodeMethod convert(String value) {
        return switch (value.toLowerCase(Locale.ROOT)) {
            case "posterior" -> DecodeMethod.POSTERIOR;
            case "viterbi" -> DecodeMethod.VITERBI;
            case "posterior-viterbi" -> DecodeMethod.POSTERIOR_VITERBI;
            default -> throw new TypeConversionException("expected posterior, viterbi or posterior-viterbi, got '"
                    + value + "'");
        };
    }
}
