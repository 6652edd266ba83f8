package org.viscarta.cli;

public final class Viscarta {
    public static void main(String[] args) {
    }
}
