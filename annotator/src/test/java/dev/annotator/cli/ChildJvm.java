package dev.annotator.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Starts the command line as a process of its own, on this test run's class path, with extra JVM options. */
final class ChildJvm {
    private ChildJvm() {
    }

    static ProcessBuilder command(List<String> jvmOptions, String... args) {
        List<String> command = new ArrayList<>();
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        command.addAll(jvmOptions);
        command.addAll(List.of("-cp", System.getProperty("java.class.path"), "dev.annotator.cli.Main"));
        command.addAll(List.of(args));
        return new ProcessBuilder(command);
    }

    static Process start(List<String> jvmOptions, String... args) throws IOException {
        return command(jvmOptions, args).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
    }
}
