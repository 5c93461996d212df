package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.request.ExecuteRequest;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class WireCodecTest {

    private static byte[] b(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void hmacSha256MatchesThePublishedTestVector() {
        WireCodec codec = new WireCodec("hmac-sha256", "Jefe");
        // Source: RFC 4231, section 4.3 (test case 2), HMAC-SHA-256 of "what do ya want for nothing?" with key "Jefe"
        assertEquals("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
                codec.sign(b("what do ya want "), b("for nothing?")));
    }

    @Test
    void signatureCoversTheFourJsonFramesInOrder() {
        WireCodec codec = new WireCodec("hmac-sha256", "Jefe");
        // Source: Jupyter messaging protocol, "The Wire Protocol": HMAC over header, parent_header,
        // metadata, content concatenated; RFC 4231 test case 2 split across four frames
        String s = codec.sign(b("what do "), b("ya want "), b("for "), b("nothing?"));
        assertEquals("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843", s);
        assertTrue(codec.verify(s.toUpperCase(java.util.Locale.ROOT), b("what do "), b("ya want "), b("for "), b("nothing?")));
        assertFalse(codec.verify(s, b("what do "), b("ya want "), b("for "), b("nothing!")));
    }

    @Test
    void roundTripsAnExecuteRequestAndRejectsATamperedOne() throws Exception {
        WireCodec codec = new WireCodec("hmac-sha256", "a-key-for-tests");
        Header<ExecuteRequest> header = new Header<>("session-1", MessageType.EXECUTE_REQUEST);
        ExecuteRequest req = new ExecuteRequest("1 + 1", false, true, Map.of(), false, true);
        Message<ExecuteRequest> m = new Message<>(List.of(b("client-id")), header, null, new LinkedHashMap<>(), req, null);
        List<byte[]> frames = codec.encode(m);
        assertArrayEquals(b("client-id"), frames.get(0));
        assertArrayEquals(WireCodec.DELIMITER, frames.get(1));

        Message<?> back = codec.decode(frames);
        assertEquals("execute_request", WireCodec.typeName(back));
        assertEquals("1 + 1", ((ExecuteRequest) back.getContent()).getCode());
        assertEquals(1, back.getIdentities().size());

        List<byte[]> tampered = new ArrayList<>(frames);
        tampered.set(tampered.size() - 1, b(new String(frames.get(frames.size() - 1), StandardCharsets.UTF_8)
                .replace("1 + 1", "2 + 2")));
        assertThrows(WireCodec.BadSignatureException.class, () -> codec.decode(tampered));

        WireCodec otherKey = new WireCodec("hmac-sha256", "another-key");
        assertThrows(WireCodec.BadSignatureException.class, () -> otherKey.decode(frames));
    }

    @Test
    void anEmptyKeyMeansNoSignature() throws Exception {
        WireCodec codec = new WireCodec("", "");
        Message<ExecuteRequest> m = new Message<>(List.of(), new Header<>("s", MessageType.EXECUTE_REQUEST), null,
                new LinkedHashMap<>(), new ExecuteRequest("x", false, true, Map.of(), false, true), null);
        List<byte[]> frames = codec.encode(m);
        // Source: Jupyter messaging protocol, "The Wire Protocol": with an empty key the signature is empty
        assertEquals(0, frames.get(1).length);
        assertEquals("x", ((ExecuteRequest) codec.decode(frames).getContent()).getCode());
    }

    @Test
    void framesWithoutTheDelimiterAreMalformed() {
        WireCodec codec = new WireCodec("hmac-sha256", "k");
        assertThrows(WireCodec.MalformedMessageException.class, () -> codec.decode(List.of(b("id"), b("{}"))));
    }

    /** Correctly signed frames carrying the given JSON texts. */
    private static List<byte[]> signed(WireCodec codec, String header, String parent, String metadata, String content) {
        byte[][] body = {b(header), b(parent), b(metadata), b(content)};
        List<byte[]> frames = new ArrayList<>(List.of(b("id"), WireCodec.DELIMITER, b(codec.sign(body))));
        frames.addAll(List.of(body));
        return frames;
    }

    @Test
    void signedMessagesOfTheWrongShapeAreMalformedNotCrashes() throws Exception {
        WireCodec codec = new WireCodec("hmac-sha256", "k");
        String good = "{\"msg_id\":\"1\",\"msg_type\":\"execute_request\",\"username\":\"u\",\"session\":\"s\",\"version\":\"5.3\"}";
        String run = "{\"code\":\"1\",\"silent\":false}";
        // the well-formed one decodes, so the refusals below are about the shape alone
        assertEquals("execute_request", WireCodec.typeName(codec.decode(signed(codec, good, "{}", "{}", run))));
        // Source: Jupyter messaging protocol 5.3, "General Message Format": a header has msg_id and msg_type (strings)
        List<String[]> bad = List.of(
                new String[] {"{}", "{}", "{}", run},
                new String[] {"{\"msg_type\":\"execute_request\"}", "{}", "{}", run},
                new String[] {"{\"msg_id\":\"1\"}", "{}", "{}", run},
                new String[] {"{\"msg_id\":7,\"msg_type\":\"execute_request\"}", "{}", "{}", run},
                new String[] {"{\"msg_id\":\"1\",\"msg_type\":[1]}", "{}", "{}", run},
                new String[] {"[]", "{}", "{}", run},
                new String[] {"null", "{}", "{}", run},
                new String[] {good.replace("\"version\":\"5.3\"", "\"date\":5"), "{}", "{}", run},
                new String[] {good, "{\"msg_id\":3}", "{}", run},
                new String[] {good, "{}", "{}", "[1, 2]"},
                new String[] {good, "{}", "{}", "null"},
                new String[] {good, "{}", "{}", "{\"code\":{\"nested\":true}}"},
                new String[] {good, "{}", "not json", run},
                new String[] {"{\"msg_id\":\"1\",\"msg_type\":\"execute_request\"", "{}", "{}", run});
        for (String[] m : bad) {
            assertThrows(WireCodec.MalformedMessageException.class, () -> codec.decode(signed(codec, m[0], m[1], m[2], m[3])),
                    String.join(" | ", m));
        }
        // missing optional header strings read as empty rather than failing later
        Message<?> lean = codec.decode(signed(codec, "{\"msg_id\":\"1\",\"msg_type\":\"kernel_info_request\"}", "{}", "{}", "{}"));
        assertEquals("kernel_info_request", WireCodec.typeName(lean));
    }

    @Test
    void unknownSignatureSchemesAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new WireCodec("hmac-md5", "k"));
        assertTrue(e.getMessage().contains("hmac-md5") && e.getMessage().contains("hmac-sha256"));
    }
}
