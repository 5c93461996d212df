package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.xml.sax.InputSource;

class TexMathTest {

    private static String body(String tex) {
        String m = TexMath.toMathMl(tex, false);
        return m.substring(m.indexOf("<mrow>") + 6, m.indexOf("</mrow><annotation"));
    }

    @Test
    void elementsFollowMathMlCore() throws Exception {
        // Source: W3C MathML Core (2023), sections 3.1-3.4: mi/mn/mo tokens, mfrac, msqrt/mroot, msub/msup/msubsup
        assertEquals("<mi>x</mi><mo>+</mo><mn>1.5</mn>", body("x + 1.5"));
        assertEquals("<mfrac><mrow><mn>1</mn></mrow><mrow><mi>N</mi></mrow></mfrac>", body("\\frac{1}{N}"));
        assertEquals("<msubsup><mi>Z</mi><mrow><mi>N</mi></mrow><mrow><mn>2</mn></mrow></msubsup>", body("Z_N^2"));
        assertEquals("<mroot><mrow><mi>N</mi></mrow><mrow><mn>3</mn></mrow></mroot>", body("\\sqrt[3]{N}"));
        assertEquals("<mi>\u03b2</mi><mi mathvariant=\"normal\">\u0394</mi><mi>\u210f</mi>", body("\\beta\\Delta\\hbar"));
        assertEquals("<mi>ln</mi><mo rspace=\"0.1667em\">\u2061</mo><mi>Z</mi>", body("\\ln Z"));
        assertEquals("<mi mathvariant=\"normal\">nK</mi>", body("\\mathrm{nK}"));
        assertEquals("<mrow><mo stretchy=\"true\">(</mo><mi>a</mi><mo stretchy=\"true\">)</mo></mrow>", body("\\left( a \\right)"));
    }

    @Test
    void delimitersGrowOnlyBetweenLeftAndRight() {
        // Source: The TeXbook, ch. 17: a delimiter typed on its own keeps its normal size; only
        // \left ... \right (and \binom, built from them) sizes it to the enclosed subformula.
        // MathML's operator dictionary makes ( ) [ ] | / stretchy by default, so each plain one says stretchy="false".
        String plain = body("g(E) = \\frac{1}{2} \\zeta(2)");
        assertEquals(4, plain.split("<mo stretchy=\"false\">[()]</mo>", -1).length - 1, plain);
        assertTrue(!plain.contains("stretchy=\"true\""), plain);
        String angle = body("\\langle M^2 \\rangle");
        assertTrue(angle.startsWith("<mo stretchy=\"false\">\u27e8</mo>"), angle);
        String sized = body("\\left[1 - \\frac{\\pi^2}{12} (T/T_F)^2\\right]");
        assertTrue(sized.startsWith("<mrow><mo stretchy=\"true\">[</mo>"), sized);
        assertTrue(sized.endsWith("<mo stretchy=\"true\">]</mo></mrow>"), sized);
        assertTrue(sized.contains("<mo stretchy=\"false\">(</mo>"), sized);
        // the solidus is an ordinary symbol in TeX: no operator space around T/T_F
        assertTrue(sized.contains("<mo stretchy=\"false\" lspace=\"0\" rspace=\"0\">/</mo>"), sized);
        // Source: The TeXbook, appendix B: | is class 0 (ordinary), \mid a relation
        assertEquals("<mo stretchy=\"false\" lspace=\"0\" rspace=\"0\">|</mo><mi>x</mi>", body("|x"));
        assertEquals("<mi>a</mi><mo stretchy=\"false\">|</mo><mi>b</mi>", body("a \\mid b"));
        String binom = body("\\binom{q + N - 1}{q}");
        assertTrue(binom.startsWith("<mrow><mo>(</mo><mfrac linethickness=\"0\">"), binom);
    }

    @Test
    void operatorNamesGetTheThinSpacesTexGivesThem() {
        // Source: The TeXbook, ch. 18 (spacing table): Ord-Op and Op-Ord get a thin space (3mu = 1/6 em),
        // Op-Open none; so k \ln L is spaced on both sides and \ln(1 + x) only before
        String thin = "<mspace width=\"0.1667em\"/>";
        assertEquals("<mi>k</mi>" + thin + "<mi>ln</mi><mo rspace=\"0.1667em\">\u2061</mo><mi>L</mi>", body("k \\ln L"));
        String call = body("k\\ln(x)");
        assertEquals("<mi>k</mi>" + thin + "<mi>ln</mi><mo>\u2061</mo><mo stretchy=\"false\">(</mo>",
                call.substring(0, call.indexOf("<mi>x")));
        assertEquals("<mo>=</mo><mi>ln</mi><mo rspace=\"0.1667em\">\u2061</mo><mi mathvariant=\"normal\">\u03a9</mi>",
                body("= \\ln\\Omega"));
    }

    @Test
    void subscriptAndSuperscriptOnOneBaseShareIt() {
        // Source: The TeXbook, ch. 17 (N_0^2 and N^2_0 both set the 0 below and the 2 above one N)
        String expected = "<msubsup><mi>N</mi><mrow><mn>0</mn></mrow><mrow><mn>2</mn></mrow></msubsup>";
        assertEquals(expected, body("N_0^2"));
        assertEquals(expected, body("N^2_0"));
        assertEquals(expected, body("N_{0}^{2}"));
    }

    @Test
    void outputIsWellFormedXmlWithTheSourceAsAnnotation() throws Exception {
        String tex = "\\langle n \\rangle = \\frac{1}{e^{(\\varepsilon - \\mu)/kT} - 1} < \\binom{E + n - 1}{E}";
        String m = TexMath.toMathMl(tex, true);
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        Document d = f.newDocumentBuilder().parse(new InputSource(new StringReader(m)));
        assertEquals("http://www.w3.org/1998/Math/MathML", d.getDocumentElement().getNamespaceURI());
        assertEquals("block", d.getDocumentElement().getAttribute("display"));
        assertEquals(tex, d.getElementsByTagName("annotation").item(0).getTextContent());
        assertTrue(m.contains("<mo>&lt;</mo>"), m);
    }

    @Test
    void unsupportedOrBrokenTexIsRefused() {
        var e = assertThrows(TexMath.UnsupportedTexException.class, () -> TexMath.toMathMl("\\begin{pmatrix}", false));
        assertTrue(e.getMessage().contains("\\begin"), e.getMessage());
        assertThrows(TexMath.UnsupportedTexException.class, () -> TexMath.toMathMl("\\frac{1}{2", false));
        assertThrows(TexMath.UnsupportedTexException.class, () -> TexMath.toMathMl("a}b", false));
        assertThrows(TexMath.UnsupportedTexException.class, () -> TexMath.toMathMl("a & b", false));
    }
}
