package org.microtally.notebook.session;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Rewrites the JVM exit calls in a class file compiled from a cell so that they throw
 * {@link ExitBlockedException} instead of ending the process.
 *
 * <p>Method (JVM specification, Java SE 17, chapter 4 "The class File Format"): the constant pool is
 * parsed; a {@code Methodref java/lang/System.exit(I)V} gets its class entry redirected to
 * {@link ExitGuard} (static to static, same descriptor, so no instruction changes and method
 * references {@code System::exit} are covered too). Each {@code invokevirtual} of
 * {@code java/lang/Runtime.exit(I)V} or {@code halt(I)V} is replaced in the method code by an
 * {@code invokestatic} of {@code ExitGuard.runtimeExit/runtimeHalt(Ljava/lang/Runtime;I)V}: same
 * length (3 bytes) and the same operand stack effect, so offsets and stack maps stay valid. New
 * constant-pool entries are appended at the end, so existing indices do not move.
 * Not covered: calls made through reflection or method handles obtained at run time, and calls
 * made by library code outside the cell.
 */
final class ExitCallRewriter {
    private static final String GUARD = "org/microtally/notebook/session/ExitGuard";

    private ExitCallRewriter() { }

    /** The patched class file, or {@code classFile} itself when it calls no exit method. */
    static byte[] rewrite(byte[] classFile) {
        try {
            return new Parsed(classFile).patch();
        } catch (RuntimeException e) {
            // A class file we cannot parse is left as the compiler produced it.
            return classFile;
        }
    }

    private static final class Parsed {
        private final byte[] in;
        private final int cpCount;
        private final int[] offsets;   // offset of each constant-pool entry's tag byte
        private final int cpEnd;

        Parsed(byte[] in) {
            this.in = in;
            ByteBuffer b = ByteBuffer.wrap(in);
            if (b.getInt(0) != 0xCAFEBABE) {
                throw new IllegalArgumentException("not a class file");
            }
            cpCount = u2(8);
            offsets = new int[cpCount];
            int p = 10;
            for (int i = 1; i < cpCount; i++) {
                offsets[i] = p;
                int tag = in[p] & 0xFF;
                switch (tag) {
                    case 1 -> p += 3 + u2(p + 1);
                    case 3, 4, 9, 10, 11, 12, 17, 18 -> p += 5;
                    case 5, 6 -> { p += 9; i++; }
                    case 7, 8, 16, 19, 20 -> p += 3;
                    case 15 -> p += 4;
                    default -> throw new IllegalArgumentException("unknown constant tag " + tag);
                }
            }
            cpEnd = p;
        }

        private int u2(int p) {
            return ((in[p] & 0xFF) << 8) | (in[p + 1] & 0xFF);
        }

        private int u4(int p) {
            return ByteBuffer.wrap(in).getInt(p);
        }

        private int tag(int i) {
            return in[offsets[i]] & 0xFF;
        }

        private String utf8(int i) {
            int p = offsets[i];
            if (tag(i) != 1) {
                return "";
            }
            return new String(in, p + 3, u2(p + 1), StandardCharsets.UTF_8); // modified UTF-8; fine for ASCII names
        }

        private String className(int classIndex) {
            return tag(classIndex) == 7 ? utf8(u2(offsets[classIndex] + 1)) : "";
        }

        byte[] patch() throws RuntimeException {
            List<Integer> systemExit = new ArrayList<>();
            Map<Integer, String> runtimeCalls = new HashMap<>(); // methodref index -> guard method name
            for (int i = 1; i < cpCount; i++) {
                if (offsets[i] == 0 || tag(i) != 10) {
                    continue;
                }
                int p = offsets[i];
                String owner = className(u2(p + 1));
                int nat = u2(p + 3);
                String name = utf8(u2(offsets[nat] + 1));
                String desc = utf8(u2(offsets[nat] + 3));
                if (!"(I)V".equals(desc)) {
                    continue;
                }
                if (owner.equals("java/lang/System") && name.equals("exit")) {
                    systemExit.add(i);
                } else if (owner.equals("java/lang/Runtime") && (name.equals("exit") || name.equals("halt"))) {
                    runtimeCalls.put(i, name.equals("exit") ? "runtimeExit" : "runtimeHalt");
                }
            }
            if (systemExit.isEmpty() && runtimeCalls.isEmpty()) {
                return in;
            }
            ByteArrayOutputStream extra = new ByteArrayOutputStream();
            DataOutputStream x = new DataOutputStream(extra);
            int next = cpCount;
            try {
                int guardUtf = next++;
                x.writeByte(1);
                x.writeUTF(GUARD);
                int guardClass = next++;
                x.writeByte(7);
                x.writeShort(guardUtf);
                Map<Integer, Integer> replacement = new HashMap<>();
                if (!runtimeCalls.isEmpty()) {
                    int descUtf = next++;
                    x.writeByte(1);
                    x.writeUTF("(Ljava/lang/Runtime;I)V");
                    Map<String, Integer> byName = new HashMap<>();
                    for (String guardMethod : new java.util.TreeSet<>(runtimeCalls.values())) {
                        int nameUtf = next++;
                        x.writeByte(1);
                        x.writeUTF(guardMethod);
                        int nat = next++;
                        x.writeByte(12);
                        x.writeShort(nameUtf);
                        x.writeShort(descUtf);
                        int ref = next++;
                        x.writeByte(10);
                        x.writeShort(guardClass);
                        x.writeShort(nat);
                        byName.put(guardMethod, ref);
                    }
                    runtimeCalls.forEach((ref, guardMethod) -> replacement.put(ref, byName.get(guardMethod)));
                }
                if (next > 0xFFFF) {
                    return in;
                }
                byte[] out = new byte[in.length + extra.size()];
                System.arraycopy(in, 0, out, 0, cpEnd);
                System.arraycopy(extra.toByteArray(), 0, out, cpEnd, extra.size());
                System.arraycopy(in, cpEnd, out, cpEnd + extra.size(), in.length - cpEnd);
                out[8] = (byte) (next >> 8);
                out[9] = (byte) next;
                for (int ref : systemExit) {
                    int p = offsets[ref];
                    out[p + 1] = (byte) (guardClass >> 8);
                    out[p + 2] = (byte) guardClass;
                }
                if (!replacement.isEmpty()) {
                    patchCode(out, extra.size(), replacement);
                }
                return out;
            } catch (IOException e) {
                throw new IllegalStateException(e);
            }
        }

        /** Walks fields, methods and their Code attributes in the shifted output, replacing invokevirtual. */
        private void patchCode(byte[] out, int shift, Map<Integer, Integer> replacement) {
            int p = cpEnd;                  // positions below are in the input; output is input + shift
            p += 6;                         // access, this, super
            int interfaces = u2(p);
            p += 2 + 2 * interfaces;
            p = skipMembers(p, null, 0, null);        // fields
            skipMembers(p, out, shift, replacement);  // methods
        }

        private int skipMembers(int p, byte[] out, int shift, Map<Integer, Integer> replacement) {
            int count = u2(p);
            p += 2;
            for (int m = 0; m < count; m++) {
                p += 6;
                int attrs = u2(p);
                p += 2;
                for (int a = 0; a < attrs; a++) {
                    String name = utf8(u2(p));
                    int len = u4(p + 2);
                    if (out != null && name.equals("Code")) {
                        int codeLen = u4(p + 10);
                        patchInstructions(p + 14, codeLen, out, shift, replacement);
                    }
                    p += 6 + len;
                }
            }
            return p;
        }

        private void patchInstructions(int start, int length, byte[] out, int shift, Map<Integer, Integer> replacement) {
            int pc = 0;
            while (pc < length) {
                int op = in[start + pc] & 0xFF;
                if (op == 0xB6) {
                    Integer target = replacement.get(u2(start + pc + 1));
                    if (target != null) {
                        int q = start + pc + shift;
                        out[q] = (byte) 0xB8;
                        out[q + 1] = (byte) (target >> 8);
                        out[q + 2] = (byte) (int) target;
                    }
                }
                pc += instructionLength(start, pc, op);
            }
        }

        private int instructionLength(int start, int pc, int op) {
            if (op <= 0x0F) return 1;
            if (op == 0x10 || op == 0x12) return 2;
            if (op == 0x11 || op == 0x13 || op == 0x14) return 3;
            if (op >= 0x15 && op <= 0x19) return 2;
            if (op >= 0x1A && op <= 0x35) return 1;
            if (op >= 0x36 && op <= 0x3A) return 2;
            if (op >= 0x3B && op <= 0x83) return 1;
            if (op == 0x84) return 3;
            if (op >= 0x85 && op <= 0x98) return 1;
            if (op >= 0x99 && op <= 0xA8) return 3;
            if (op == 0xA9) return 2;
            if (op == 0xAA || op == 0xAB) {
                int q = pc + 1;
                q += (4 - (q % 4)) % 4;
                int base = start + q;
                if (op == 0xAA) {
                    int low = u4(base + 4);
                    int high = u4(base + 8);
                    return q - pc + 12 + 4 * (high - low + 1);
                }
                int pairs = u4(base + 4);
                return q - pc + 8 + 8 * pairs;
            }
            if (op >= 0xAC && op <= 0xB1) return 1;
            if (op >= 0xB2 && op <= 0xB8) return 3;
            if (op == 0xB9 || op == 0xBA) return 5;
            if (op == 0xBB || op == 0xBD || op == 0xC0 || op == 0xC1) return 3;
            if (op == 0xBC) return 2;
            if (op == 0xBE || op == 0xBF || op == 0xC2 || op == 0xC3) return 1;
            if (op == 0xC4) return (in[start + pc + 1] & 0xFF) == 0x84 ? 6 : 4;
            if (op == 0xC5) return 4;
            if (op == 0xC6 || op == 0xC7) return 3;
            if (op == 0xC8 || op == 0xC9) return 5;
            throw new IllegalArgumentException("unknown opcode " + op);
        }
    }
}
