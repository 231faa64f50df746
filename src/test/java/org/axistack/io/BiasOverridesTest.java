package org.axistack.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.axistack.model.Stack;
import org.junit.jupiter.api.Test;

class BiasOverridesTest {

    static final Set<StackMessage> COVERED = EnumSet.of(StackMessage.SET_SYNTAX, StackMessage.SET_UNKNOWN_NAME,
            StackMessage.SET_BAD_NUMBER, StackMessage.SET_TWICE, StackMessage.TOUCH);

    private static Stack base() throws StackInputException {
        return StackReader.parse(MalformedStacks.BASE, "base.toml");
    }

    @Test
    void setsBiasesIncludingNegativeAndExponentForms() throws Exception {
        Stack s = BiasOverrides.apply(base(), List.of("b=-1400", "a=2.5e3"));
        assertThat(s.electrode("b").bias_V()).isEqualTo(-1400.0);
        assertThat(s.electrode("a").bias_V()).isEqualTo(2500.0);
        assertThat(BiasOverrides.apply(base(), List.of())).isEqualTo(base());
    }

    @Test
    void rejectsBadArguments() {
        assertThatThrownBy(() -> BiasOverrides.apply(base(), List.of("b")))
                .hasMessageContaining("not of the form NAME=VOLTS").hasMessageContaining("--set focus=-1400");
        assertThatThrownBy(() -> BiasOverrides.apply(base(), List.of("=5")))
                .isInstanceOfSatisfying(StackInputException.class, e -> assertThat(e.id()).isEqualTo(StackMessage.SET_SYNTAX));
        assertThatThrownBy(() -> BiasOverrides.apply(base(), List.of("bb=5")))
                .hasMessageContaining("does not have (did you mean 'b'?)").hasMessageContaining("a, b");
        for (String bad : List.of("b=abc", "b=NaN", "b=Infinity", "b=1e400", "b=5kV", "b=0x10", "b=1e9")) {
            assertThatThrownBy(() -> BiasOverrides.apply(base(), List.of(bad)))
                    .as(bad).isInstanceOfSatisfying(StackInputException.class,
                            e -> assertThat(e.id()).isEqualTo(StackMessage.SET_BAD_NUMBER));
        }
        assertThatThrownBy(() -> BiasOverrides.apply(base(), List.of("b=1", "b=2")))
                .hasMessageContaining("two biases");
    }

    @Test
    void touchingElectrodesAtTheSameBiasMayNotBeSetApart() throws Exception {
        Stack touching = StackReader.parse(MalformedStacks.edit("z_end_mm = -1.0", "z_end_mm = 1.0")
                .replace("bias_V = -300.0", "bias_V = 0.0"), "touch.toml");
        assertThatThrownBy(() -> BiasOverrides.apply(touching, List.of("b=-300")))
                .isInstanceOfSatisfying(StackInputException.class, e -> {
                    assertThat(e.id()).isEqualTo(StackMessage.TOUCH);
                    assertThat(e.getMessage()).startsWith("command line (--set)").contains("'a' (0 V) and 'b' (-300 V");
                });
    }
}
