package org.microtally.kernel;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.JsonParser;
import com.google.gson.reflect.TypeToken;
import io.github.spencerpark.jupyter.kernel.ExpressionValue;
import io.github.spencerpark.jupyter.kernel.history.HistoryEntry;
import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.KernelTimestamp;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.ReplyType;
import io.github.spencerpark.jupyter.messages.adapters.ExpressionValueAdapter;
import io.github.spencerpark.jupyter.messages.adapters.HeaderAdapter;
import io.github.spencerpark.jupyter.messages.adapters.HistoryEntryAdapter;
import io.github.spencerpark.jupyter.messages.adapters.HistoryRequestAdapter;
import io.github.spencerpark.jupyter.messages.adapters.KernelTimestampAdapter;
import io.github.spencerpark.jupyter.messages.adapters.MessageTypeAdapter;
import io.github.spencerpark.jupyter.messages.adapters.PublishStatusAdapter;
import io.github.spencerpark.jupyter.messages.adapters.ReplyTypeAdapter;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
import io.github.spencerpark.jupyter.messages.request.HistoryRequest;
import java.lang.reflect.Type;
import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;

/**
 * Encodes and decodes Jupyter wire messages (messaging protocol 5.x, "The Wire Protocol"): routing
 * identities, the {@code <IDS|MSG>} delimiter, the HMAC signature, then the header, parent header,
 * metadata and content JSON frames, then optional binary buffers.
 *
 * <p>Signatures are HMAC-SHA256 (the only scheme Jupyter clients use) over the four JSON frames,
 * hex-encoded in lower case; verification compares in constant time
 * ({@link MessageDigest#isEqual}). An empty key means "no authentication", as the protocol states:
 * then the signature frame is empty and not checked.
 *
 * <p>The JSON mapping of headers and contents is the message model of jupyter-jvm-basekernel, built
 * here from that library's public type adapters exactly as its own socket class combines them (no
 * reflection into the library); the library's socket reader is not used because it compares
 * signatures with {@code String.equals} and blocks its caller.
 *
 * <p>Decoding never throws anything but the two checked exceptions below: a header or parent header
 * that is not an object with string {@code msg_id} and {@code msg_type}, a content that is not a
 * JSON object, or JSON the model cannot map, is a {@link MalformedMessageException}.
 */
final class WireCodec {
    static final byte[] DELIMITER = "<IDS|MSG>".getBytes(StandardCharsets.US_ASCII);
    private static final byte[] EMPTY_OBJECT = "{}".getBytes(StandardCharsets.UTF_8);
    private static final Type METADATA_TYPE = new TypeToken<Map<String, Object>>() { }.getType();
    private static final Gson GSON = libraryGson();

    private final Mac mac;

    /** Thrown for a message whose signature does not match the key; the message must be dropped. */
    static final class BadSignatureException extends Exception {
        private static final long serialVersionUID = 1L;

        BadSignatureException(String message) {
            super(message);
        }
    }

    /** Thrown for frames that are not a Jupyter message. */
    static final class MalformedMessageException extends Exception {
        private static final long serialVersionUID = 1L;

        MalformedMessageException(String message) {
            super(message);
        }
    }

    /**
     * @param scheme signature scheme from the connection file ({@code hmac-sha256}; empty with an empty key)
     * @param key    the key from the connection file, used as UTF-8 bytes; empty disables signing
     */
    WireCodec(String scheme, String key) {
        if (key == null || key.isEmpty()) {
            this.mac = null;
            return;
        }
        String normalized = scheme == null ? "" : scheme.toLowerCase(java.util.Locale.ROOT);
        if (!normalized.equals("hmac-sha256")) {
            throw new IllegalArgumentException("unsupported signature_scheme '" + scheme
                    + "' in the connection file; allowed: hmac-sha256. Let Jupyter write the connection file.");
        }
        try {
            Mac m = Mac.getInstance("HmacSHA256");
            m.init(new SecretKeySpec(key.getBytes(StandardCharsets.UTF_8), "HmacSHA256"));
            this.mac = m;
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("HmacSHA256 is not available in this JVM", e);
        }
    }

    /** The library's JSON mapping, from its public adapters (the recipe of its JupyterSocket, version 2.3.0). */
    private static Gson libraryGson() {
        Gson replyGson = new GsonBuilder()
                .registerTypeAdapter(HistoryEntry.class, HistoryEntryAdapter.INSTANCE)
                .registerTypeAdapter(ExpressionValue.class, ExpressionValueAdapter.INSTANCE)
                .create();
        return new GsonBuilder()
                .registerTypeAdapter(KernelTimestamp.class, KernelTimestampAdapter.INSTANCE)
                .registerTypeAdapter(Header.class, HeaderAdapter.INSTANCE)
                .registerTypeAdapter(MessageType.class, MessageTypeAdapter.INSTANCE)
                .registerTypeAdapter(PublishStatus.class, PublishStatusAdapter.INSTANCE)
                .registerTypeAdapter(HistoryRequest.class, HistoryRequestAdapter.INSTANCE)
                .registerTypeHierarchyAdapter(ReplyType.class, new ReplyTypeAdapter(replyGson))
                .create();
    }

    static Gson gson() {
        return GSON;
    }

    /** Lower-case hex HMAC-SHA256 over the frames, or "" when signing is off. */
    String sign(byte[]... frames) {
        if (mac == null) {
            return "";
        }
        synchronized (mac) {
            for (byte[] f : frames) {
                mac.update(f);
            }
            return HexFormat.of().formatHex(mac.doFinal());
        }
    }

    /** Whether {@code signature} is the right one for the frames (constant-time compare). */
    boolean verify(String signature, byte[]... frames) {
        if (mac == null) {
            return true;
        }
        byte[] expected = sign(frames).getBytes(StandardCharsets.US_ASCII);
        byte[] given = signature.toLowerCase(java.util.Locale.ROOT).getBytes(StandardCharsets.US_ASCII);
        return MessageDigest.isEqual(expected, given);
    }

    /** The frames to send for {@code message}, identities first. */
    List<byte[]> encode(Message<?> message) {
        byte[] header = GSON.toJson(message.getHeader()).getBytes(StandardCharsets.UTF_8);
        byte[] parent = message.hasParentHeader()
                ? GSON.toJson(message.getParentHeader()).getBytes(StandardCharsets.UTF_8) : EMPTY_OBJECT;
        byte[] metadata = message.hasMetadata()
                ? GSON.toJson(message.getMetadata()).getBytes(StandardCharsets.UTF_8) : EMPTY_OBJECT;
        Object content = message.getContent();
        byte[] body = content == null ? EMPTY_OBJECT : GSON.toJson(content).getBytes(StandardCharsets.UTF_8);
        List<byte[]> frames = new ArrayList<>();
        if (message.getIdentities() != null) {
            frames.addAll(message.getIdentities());
        }
        frames.add(DELIMITER);
        frames.add(sign(header, parent, metadata, body).getBytes(StandardCharsets.US_ASCII));
        frames.add(header);
        frames.add(parent);
        frames.add(metadata);
        frames.add(body);
        if (message.getBlobs() != null) {
            frames.addAll(message.getBlobs());
        }
        return frames;
    }

    /**
     * The message carried by {@code frames}, after checking its signature.
     *
     * @throws BadSignatureException     when the signature does not match (the caller drops the message)
     * @throws MalformedMessageException when the frames are not a Jupyter message
     */
    Message<?> decode(List<byte[]> frames) throws BadSignatureException, MalformedMessageException {
        int d = 0;
        while (d < frames.size() && !java.util.Arrays.equals(frames.get(d), DELIMITER)) {
            d++;
        }
        if (frames.size() < d + 6) {
            throw new MalformedMessageException("expected <IDS|MSG> then signature, header, parent, metadata, content; got "
                    + frames.size() + " frames");
        }
        List<byte[]> identities = new ArrayList<>(frames.subList(0, d));
        String signature = new String(frames.get(d + 1), StandardCharsets.US_ASCII);
        byte[] header = frames.get(d + 2);
        byte[] parent = frames.get(d + 3);
        byte[] metadata = frames.get(d + 4);
        byte[] content = frames.get(d + 5);
        if (!verify(signature, header, parent, metadata, content)) {
            throw new BadSignatureException("signature does not match the connection key");
        }
        List<byte[]> blobs = new ArrayList<>(frames.subList(d + 6, frames.size()));
        try {
            Header<?> h = header(JsonParser.parseString(utf8(header)), "header");
            JsonElement p = JsonParser.parseString(utf8(parent));
            Header<?> ph = p.isJsonObject() && p.getAsJsonObject().size() > 0 ? header(p, "parent header") : null;
            JsonElement metaTree = JsonParser.parseString(utf8(metadata));
            Map<String, Object> meta = metaTree.isJsonObject() ? GSON.fromJson(metaTree, METADATA_TYPE) : null;
            JsonElement bodyTree = JsonParser.parseString(utf8(content));
            if (!bodyTree.isJsonObject()) {
                throw new MalformedMessageException("the content of " + h.getType().getName() + " is not a JSON object");
            }
            Class<?> contentType = h.getType().getContentType();
            Object body = GSON.fromJson(bodyTree, contentType == null ? Object.class : contentType);
            return build(identities, h, ph, meta == null ? new LinkedHashMap<>() : meta, body, blobs);
        } catch (RuntimeException e) {
            // JsonParseException, IllegalStateException, NumberFormatException, ... from the JSON mapping
            throw new MalformedMessageException("not a Jupyter message: " + e.getClass().getSimpleName()
                    + (e.getMessage() == null ? "" : ": " + e.getMessage()));
        }
    }

    private static final List<String> HEADER_STRINGS = List.of("msg_id", "msg_type", "username", "session", "version");

    /**
     * A header after checking its shape: an object whose msg_id and msg_type are non-empty strings;
     * username, session and version, when present, strings (missing ones read as empty), and a date
     * that is a string when present.
     */
    private static Header<?> header(JsonElement tree, String what) throws MalformedMessageException {
        if (!tree.isJsonObject()) {
            throw new MalformedMessageException("the " + what + " is not a JSON object");
        }
        JsonObject o = tree.getAsJsonObject().deepCopy();
        for (String field : HEADER_STRINGS) {
            JsonElement v = o.get(field);
            boolean required = field.equals("msg_id") || field.equals("msg_type");
            if (v == null || v.isJsonNull()) {
                if (required) {
                    throw new MalformedMessageException("the " + what + " has no " + field);
                }
                o.addProperty(field, "");
            } else if (!v.isJsonPrimitive() || !v.getAsJsonPrimitive().isString() || (required && v.getAsString().isEmpty())) {
                throw new MalformedMessageException("the " + what + "'s " + field + " is not a non-empty string: " + v);
            }
        }
        JsonElement date = o.get("date");
        if (date != null && !date.isJsonNull() && !(date.isJsonPrimitive() && date.getAsJsonPrimitive().isString())) {
            throw new MalformedMessageException("the " + what + "'s date is not a string: " + date);
        }
        Header<?> h = GSON.fromJson(o, Header.class);
        if (h == null || h.getType() == null) {
            throw new MalformedMessageException("the " + what + " names no known msg_type");
        }
        return h;
    }

    @SuppressWarnings({"unchecked", "rawtypes"})
    private static Message<?> build(List<byte[]> ids, Header<?> h, Header<?> parent, Map<String, Object> meta,
                                    Object body, List<byte[]> blobs) {
        return new Message(ids, h, parent, meta, body, blobs);
    }

    /** The message type named in a header frame, for logging dropped messages. */
    static String typeName(Message<?> m) {
        MessageType<?> t = m.getHeader() == null ? null : m.getHeader().getType();
        return t == null ? "?" : t.getName();
    }

    private static String utf8(byte[] b) {
        return new String(b, StandardCharsets.UTF_8);
    }
}
