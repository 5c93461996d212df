package org.microtally.notebook.session;

import java.util.Map;
import org.objectweb.asm.ClassReader;
import org.objectweb.asm.ClassVisitor;
import org.objectweb.asm.ClassWriter;
import org.objectweb.asm.Handle;
import org.objectweb.asm.MethodVisitor;
import org.objectweb.asm.Opcodes;

/**
 * Rewrites the calls in a class file compiled from a cell that could end the JVM, so that they go
 * through {@link ExitGuard} instead (ASM 9, the visitor API: {@code ClassReader} -&gt;
 * {@code ClassWriter}, constant pool copied, each rewritten instruction with the same operand-stack
 * effect so no frame is recomputed).
 *
 * <p>Rewritten: {@code System.exit}, {@code Runtime.exit}, {@code Runtime.halt} (calls, and method
 * references in {@code invokedynamic} bootstrap arguments and {@code ldc} method-handle constants);
 * and the doors to them at run time: {@code Method.invoke}, {@code MethodHandles.Lookup.findStatic},
 * {@code findVirtual}, {@code unreflect} and {@code bind}, whose guarded versions refuse (or hand back a guarded
 * handle for) the exit methods and otherwise do exactly what the original does. Threads a cell
 * starts run cell code, so they are covered too. Not covered: library code outside the cell that
 * calls exit itself; the runner and the kernel report that case when it happens.
 */
final class ExitCallRewriter {
    private static final String GUARD = "org/microtally/notebook/session/ExitGuard";
    private static final String LOOKUP = "java/lang/invoke/MethodHandles$Lookup";

    /** owner.name+descriptor of an instance or static call -&gt; the ExitGuard method and its descriptor. */
    private static final Map<String, String[]> CALLS = Map.of(
            "java/lang/System.exit(I)V", new String[] {"exit", "(I)V"},
            "java/lang/Runtime.exit(I)V", new String[] {"runtimeExit", "(Ljava/lang/Runtime;I)V"},
            "java/lang/Runtime.halt(I)V", new String[] {"runtimeHalt", "(Ljava/lang/Runtime;I)V"},
            "java/lang/reflect/Method.invoke(Ljava/lang/Object;[Ljava/lang/Object;)Ljava/lang/Object;",
            new String[] {"invoke", "(Ljava/lang/reflect/Method;Ljava/lang/Object;[Ljava/lang/Object;)Ljava/lang/Object;"},
            LOOKUP + ".findStatic(Ljava/lang/Class;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;",
            new String[] {"findStatic", "(L" + LOOKUP + ";Ljava/lang/Class;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;"},
            LOOKUP + ".findVirtual(Ljava/lang/Class;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;",
            new String[] {"findVirtual", "(L" + LOOKUP + ";Ljava/lang/Class;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;"},
            LOOKUP + ".unreflect(Ljava/lang/reflect/Method;)Ljava/lang/invoke/MethodHandle;",
            new String[] {"unreflect", "(L" + LOOKUP + ";Ljava/lang/reflect/Method;)Ljava/lang/invoke/MethodHandle;"},
            LOOKUP + ".bind(Ljava/lang/Object;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;",
            new String[] {"bind", "(L" + LOOKUP + ";Ljava/lang/Object;Ljava/lang/String;Ljava/lang/invoke/MethodType;)Ljava/lang/invoke/MethodHandle;"});

    private ExitCallRewriter() { }

    /** The rewritten class file, or {@code classFile} itself when it calls none of the guarded methods. */
    static byte[] rewrite(byte[] classFile) {
        ClassReader reader;
        try {
            reader = new ClassReader(classFile);
        } catch (RuntimeException e) {
            return classFile;   // not a class file ASM can read: left as the compiler produced it
        }
        ClassWriter writer = new ClassWriter(reader, 0);
        boolean[] changed = {false};
        reader.accept(new ClassVisitor(Opcodes.ASM9, writer) {
            @Override
            public MethodVisitor visitMethod(int access, String name, String descriptor, String signature, String[] exceptions) {
                return new Guarding(super.visitMethod(access, name, descriptor, signature, exceptions), changed);
            }
        }, 0);
        return changed[0] ? writer.toByteArray() : classFile;
    }

    private static final class Guarding extends MethodVisitor {
        private final boolean[] changed;

        Guarding(MethodVisitor next, boolean[] changed) {
            super(Opcodes.ASM9, next);
            this.changed = changed;
        }

        @Override
        public void visitMethodInsn(int opcode, String owner, String name, String descriptor, boolean isInterface) {
            String[] target = (opcode == Opcodes.INVOKESTATIC || opcode == Opcodes.INVOKEVIRTUAL)
                    ? CALLS.get(owner + "." + name + descriptor) : null;
            if (target != null) {
                changed[0] = true;
                super.visitMethodInsn(Opcodes.INVOKESTATIC, GUARD, target[0], target[1], false);
            } else {
                super.visitMethodInsn(opcode, owner, name, descriptor, isInterface);
            }
        }

        @Override
        public void visitInvokeDynamicInsn(String name, String descriptor, Handle bootstrap, Object... args) {
            Object[] guarded = args.clone();
            for (int i = 0; i < guarded.length; i++) {
                guarded[i] = guard(guarded[i]);
            }
            super.visitInvokeDynamicInsn(name, descriptor, bootstrap, guarded);
        }

        @Override
        public void visitLdcInsn(Object value) {
            super.visitLdcInsn(guard(value));
        }

        /** A method-handle constant of a guarded method becomes one of its ExitGuard counterpart. */
        private Object guard(Object constant) {
            if (constant instanceof Handle h && (h.getTag() == Opcodes.H_INVOKESTATIC || h.getTag() == Opcodes.H_INVOKEVIRTUAL)) {
                String[] target = CALLS.get(h.getOwner() + "." + h.getName() + h.getDesc());
                if (target != null) {
                    changed[0] = true;
                    return new Handle(Opcodes.H_INVOKESTATIC, GUARD, target[0], target[1], false);
                }
            }
            return constant;
        }
    }
}
