package org.axistack.cli;

import picocli.CommandLine;

/** Version text for --version. */
final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        String v = Main.class.getPackage().getImplementationVersion();
        return new String[] {"axistack " + (v == null ? "(development build)" : v)};
    }
}
