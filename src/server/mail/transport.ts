import "server-only";
import nodemailer from "nodemailer";
import { env } from "../env";

export const mailTransport = nodemailer.createTransport(env.SMTP_URL, { from: env.MAIL_FROM });
